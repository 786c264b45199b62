import { Link } from "react-router-dom";
import { useBatch } from "../../api/batches";
import { ButtonLink } from "../../components/Button";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { BatchProgress } from "./BatchProgress";
import { formatDateTime } from "@shared/format/dates";

/** One batch's page: progress while it runs (it keeps going if this page is closed), outcome after. */
export function BatchView({ labId, batchId }: { labId: string; batchId: string }) {
  const batch = useBatch(labId, batchId);
  return (
    <QueryState query={batch} what="the batch">
      {(b) => (
        <>
          <PageTitle
            subtitle={
              <>
                Into session{" "}
                <Link className="font-bold text-petrol-700 underline" to={labPaths.session(labId, b.session.id)}>
                  {b.session.title}
                </Link>{" "}
                · uploaded {formatDateTime(b.createdAt)} by {b.createdBy?.displayName ?? "—"}
                {b.origin === "token" ? " with an API token" : ""}
              </>
            }
            actions={<ButtonLink variant="secondary" to={`/labs/${labId}/batches?session=${b.session.id}`}>Upload more files</ButtonLink>}
          >
            {`Batch of ${b.fileCount} file${b.fileCount === 1 ? "" : "s"}`}
          </PageTitle>
          <Panel>
            {!b.done && <p className="mb-3 text-sm text-ink-soft">The batch runs on the server: you can leave this page and come back; nothing stops when it closes.</p>}
            <BatchProgress batch={b} />
          </Panel>
        </>
      )}
    </QueryState>
  );
}
