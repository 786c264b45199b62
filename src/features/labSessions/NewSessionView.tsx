import { useNavigate, useSearchParams } from "react-router-dom";
import { useCreateLabSession } from "../../api/labSessions";
import { useSources } from "../../api/sources";
import { ButtonLink } from "../../components/Button";
import { PageTitle } from "../../components/PageTitle";
import { EmptyState, QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { SessionSetupForm, sessionFormDefaults } from "./SessionSetupForm";

/** Open a new lab session: the setup that every run in it shares. */
export function NewSessionView({ labId }: { labId: string }) {
  const [params] = useSearchParams();
  const sources = useSources(labId, { pageSize: 100 });
  const create = useCreateLabSession(labId);
  const navigate = useNavigate();
  return (
    <>
      <PageTitle subtitle="One day or series of measurements on one setup. Every run in it shares this setup.">New session</PageTitle>
      <QueryState query={sources} what="sources">
        {(p) =>
          p.data.length === 0 ? (
            <EmptyState title="Add a source first" action={<ButtonLink to={labPaths.sources(labId)}>Add a source</ButtonLink>}>
              A session belongs to the pair source it measures.
            </EmptyState>
          ) : (
            <SessionSetupForm
              sources={p.data}
              initial={sessionFormDefaults(undefined, params.get("sourceId") ?? (p.data.length === 1 ? p.data[0].id : undefined))}
              submitLabel="Open session"
              pending={create.isPending}
              error={create.error}
              onSubmit={async (v) => {
                const s = await create.mutateAsync(v);
                navigate(labPaths.session(labId, s.id));
              }}
            />
          )
        }
      </QueryState>
    </>
  );
}
