import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { useUploadBatch } from "../../api/batches";
import { useLab } from "../../api/labs";
import { useLabSessions } from "../../api/labSessions";
import { Alert } from "../../components/Alert";
import { Button, ButtonLink } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { PageTitle } from "../../components/PageTitle";
import { Panel } from "../../components/Panel";
import { EmptyState, QueryState } from "../../components/QueryState";
import { labPaths } from "../notebook/labPaths";
import { addFiles, batchProblem, fileSize, type ChosenFile } from "./batchFileChecks";
import { FileDropZone } from "./FileDropZone";
import { FormatHelp } from "./FormatHelp";
import { RecentBatches } from "./RecentBatches";

/** Many run files at once into one session; the batch then runs in the background. */
export function BatchUploadView({ labId, initialSessionId }: { labId: string; initialSessionId: string | null }) {
  const lab = useLab(labId);
  const sessions = useLabSessions(labId, { pageSize: 100, sort: "date", order: "desc" });
  const [sessionId, setSessionId] = useState(initialSessionId ?? "");
  const [chosen, setChosen] = useState<ChosenFile[]>([]);
  const upload = useUploadBatch(labId);
  const navigate = useNavigate();
  const problem = batchProblem(chosen);
  const canWrite = lab.data?.can.write ?? false;

  const send = async () => {
    const batch = await upload.mutateAsync({ sessionId, files: chosen.map((c) => c.file) }).catch(() => null);
    if (batch) navigate(`/labs/${labId}/batches/${batch.id}`);
  };

  return (
    <>
      <PageTitle subtitle="Many runs at once — a sweep, a day of measurements — each file checked and stored on its own.">Batch upload</PageTitle>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="min-w-0 space-y-4">
          <Panel title="Files and session">
            <QueryState query={sessions} what="sessions">
              {(page) =>
                page.data.length === 0 ? (
                  <EmptyState title="This lab has no sessions yet" action={canWrite && <ButtonLink to={labPaths.newSession(labId)}>New session</ButtonLink>}>
                    Runs always belong to a session (a day or series of measurements on one setup). Create one, then upload its files here.
                  </EmptyState>
                ) : !canWrite ? (
                  <Alert kind="info" title="Your role in this lab is read-only">
                    Viewers can follow batches below but cannot upload runs. Ask an owner for the member role.
                  </Alert>
                ) : (
                  <div className="space-y-4">
                    <Field label="Into session" hint="Every run of the batch goes into this session and is reconstructed with its setup (window, calibrations, handedness).">
                      {(p) => (
                        <select {...fieldProps(p)} value={sessionId} onChange={(e) => setSessionId(e.target.value)} className={`${inputClass} min-w-0 max-w-xl`}>
                          <option value="">Choose a session…</option>
                          {page.data.map((s) => (
                            <option key={s.id} value={s.id}>
                              {s.date} · {s.title} ({s.source.name})
                            </option>
                          ))}
                        </select>
                      )}
                    </Field>
                    <FileDropZone onFiles={(files) => setChosen((c) => addFiles(c, files))} disabled={upload.isPending} />
                    {chosen.length > 0 && <ChosenList chosen={chosen} onRemove={(i) => setChosen((c) => c.filter((_, k) => k !== i))} />}
                    {problem && <Alert kind="error" title="This batch is too large">{problem}</Alert>}
                    {upload.isError && (
                      <Alert kind="error" title="The batch was not accepted">
                        {upload.error.message} Nothing was stored.
                      </Alert>
                    )}
                    <div className="flex flex-wrap items-center gap-3">
                      <Button onClick={send} disabled={!sessionId || chosen.length === 0 || !!problem || upload.isPending}>
                        {upload.isPending ? "Sending…" : `Upload ${chosen.length || ""} file${chosen.length === 1 ? "" : "s"}`}
                      </Button>
                      {chosen.length > 0 && !upload.isPending && (
                        <Button variant="quiet" onClick={() => setChosen([])}>
                          Clear the list
                        </Button>
                      )}
                      {!sessionId && chosen.length > 0 && <span className="text-sm text-ink-soft">Choose the session first.</span>}
                    </div>
                  </div>
                )
              }
            </QueryState>
          </Panel>
          <RecentBatches labId={labId} />
        </div>
        <FormatHelp sessionId={sessionId || null} />
      </div>
    </>
  );
}

function ChosenList({ chosen, onRemove }: { chosen: ChosenFile[]; onRemove: (index: number) => void }) {
  const total = chosen.reduce((s, c) => s + c.file.size, 0);
  const refused = chosen.filter((c) => c.problem).length;
  return (
    <div>
      <p className="text-sm font-bold text-ink">
        {chosen.length} file{chosen.length === 1 ? "" : "s"}, {fileSize(total)}
        {refused > 0 && <span className="text-caution"> — {refused === 1 ? "1 cannot be stored as it is" : `${refused} cannot be stored as they are`}</span>}
      </p>
      <ul className="mt-2 max-h-64 divide-y divide-paper-sunk overflow-y-auto rounded-md border border-paper-sunk text-sm">
        {chosen.map((c, i) => (
          <li key={`${c.file.name}-${i}`} className="flex items-center gap-3 px-3 py-1.5">
            <span className="min-w-0 flex-1 truncate text-ink" title={c.file.name}>
              {c.file.name}
            </span>
            {c.problem && <span className="text-caution">■ {c.problem}</span>}
            <span className="num text-ink-faint">{fileSize(c.file.size)}</span>
            <button type="button" className="rounded px-1.5 text-ink-soft hover:bg-paper-sunk hover:text-danger" onClick={() => onRemove(i)} aria-label={`Remove ${c.file.name}`}>
              ✕
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}
