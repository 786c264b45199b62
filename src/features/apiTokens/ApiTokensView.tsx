import { useState } from "react";
import type { CreatedApiTokenDto } from "@shared/schemas/apiTokens";
import { useApiTokens } from "../../api/apiTokens";
import { useLabs } from "../../api/labs";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { QueryState } from "../../components/QueryState";
import { lastLabId } from "../labs/lastLab";
import { CreateTokenForm } from "./CreateTokenForm";
import { NewTokenSecret } from "./NewTokenSecret";
import { TokensTable } from "./TokensTable";

/** Personal API tokens: create (secret shown once), list, revoke. */
export function ApiTokensView() {
  const labs = useLabs();
  const tokens = useApiTokens();
  const [created, setCreated] = useState<CreatedApiTokenDto | null>(null);
  return (
    <>
      <PageTitle subtitle="Let an acquisition script or the rhomb command line add runs to one of your labs in your name — without your password.">API tokens</PageTitle>
      <div className="space-y-4">
        <Panel title={created ? "Your new token" : "New token"}>
          {created ? (
            <NewTokenSecret token={created} onDone={() => setCreated(null)} />
          ) : (
            <QueryState query={labs} what="your labs">
              {(list) => <CreateTokenForm labs={list} defaultLabId={lastLabId() ?? undefined} onCreated={setCreated} />}
            </QueryState>
          )}
        </Panel>
        <Panel title="Your tokens">
          <QueryState query={tokens} what="your tokens">
            {(list) => <TokensTable tokens={list} />}
          </QueryState>
        </Panel>
      </div>
    </>
  );
}
