import { ApiError } from "../../api/client";
import { Alert } from "../../components/Alert";

/** Why a shared item does not open: no longer valid (410), unknown (404), or something else. */
export function ShareProblem({ error }: { error: Error }) {
  const status = error instanceof ApiError ? error.status : 0;
  if (status === 410) {
    return (
      <Alert kind="caution" title="This link is no longer valid">
        {error.message}
      </Alert>
    );
  }
  if (status === 404) {
    return (
      <Alert kind="error" title="Nothing is shared at this address">
        The link is not one that Rhomb knows: check that it was copied whole, or ask the person who sent it for a new one.
      </Alert>
    );
  }
  return (
    <Alert kind="error" title="The shared item could not be opened">
      {error.message}
    </Alert>
  );
}
