import { useHealth } from "../api/health";
import { Alert } from "../components/Alert";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";
import { StatusBadge } from "../components/StatusBadge";

/** System status: the API and database health, refreshed every 10 s. */
export function StatusPage() {
  const health = useHealth();
  return (
    <>
      <PageTitle subtitle="Is the server up, and can it reach its database?">System status</PageTitle>
      {health.isPending && <p className="text-ink-soft" role="status">Asking the server…</p>}
      {health.isError && (
        <Alert kind="error" title="The server did not answer">
          {health.error.message}
        </Alert>
      )}
      {health.data && (
        <div className="grid gap-4 md:grid-cols-2">
          <Panel title="API">
            <StatusBadge tone="up">Up</StatusBadge>
            <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-faint">Version</dt>
              <dd>{health.data.api.version}</dd>
              <dt className="text-ink-faint">Uptime</dt>
              <dd className="tabular-nums">{health.data.api.uptimeSeconds} s</dd>
            </dl>
          </Panel>
          <Panel title="Database">
            {health.data.database.status === "up" ? (
              <>
                <StatusBadge tone="up">Up</StatusBadge>
                <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
                  <dt className="text-ink-faint">PostgreSQL</dt>
                  <dd>{health.data.database.version}</dd>
                  <dt className="text-ink-faint">Round trip</dt>
                  <dd className="tabular-nums">{health.data.database.latencyMs} ms</dd>
                </dl>
              </>
            ) : (
              <>
                <StatusBadge tone="down">Down</StatusBadge>
                <p className="mt-3 text-sm text-ink-soft">{health.data.database.error}</p>
              </>
            )}
          </Panel>
        </div>
      )}
    </>
  );
}
