import { useEffect } from "react";
import { useMatch } from "react-router-dom";
import { rememberLab } from "./lastLab";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The lab of the page on screen (/labs/:labId/...), remembered as the last one used. */
export function useCurrentLabId(): string | undefined {
  const match = useMatch("/labs/:labId/*");
  const labId = match?.params.labId && UUID.test(match.params.labId) ? match.params.labId : undefined;
  useEffect(() => {
    if (labId) rememberLab(labId);
  }, [labId]);
  return labId;
}
