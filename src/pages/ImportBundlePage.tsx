import { useParams } from "react-router-dom";
import { BackLink } from "../components/BackLink";
import { PageTitle } from "../components/PageTitle";
import { RequireSignIn } from "../features/account/RequireSignIn";
import { ImportBundleForm } from "../features/exports/ImportBundleForm";
import { labPaths } from "../features/notebook/labPaths";

/** /labs/:labId/import — a session bundle becomes a new session of this lab. */
export function ImportBundlePage() {
  const { labId = "" } = useParams();
  return (
    <RequireSignIn>
      <BackLink to={labPaths.home(labId)}>Lab home</BackLink>
      <PageTitle subtitle="Runs, every revision of their raw counts, reconstructions and uploaded files come in as they were, with new ids, in one step: all of it or nothing.">Import a session bundle</PageTitle>
      <ImportBundleForm labId={labId} />
    </RequireSignIn>
  );
}
