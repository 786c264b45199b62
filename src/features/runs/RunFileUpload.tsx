import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { LIMITS } from "@shared/limits";
import { parseTomographyCsv, type ParsedTomographyCsv } from "@shared/formats/tomographyCsv";
import { useUploadRun } from "../../api/runs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { labPaths } from "../notebook/labPaths";

const EXAMPLE = "# Sagnac-2, 5 mW\nbasis,counts,seconds,singles_a,singles_b\nHH,12,1,41020,39877\nHV,1987,1,40911,40102\n…";

/**
 * One CSV file in Rhomb's counts format. The browser reads it with the same parser as the server
 * first, so a mistake is named (row and column) before anything is sent; the server keeps the
 * file exactly as it came.
 */
export function RunFileUpload({ labId, sessionId }: { labId: string; sessionId: string }) {
  const upload = useUploadRun(labId, sessionId);
  const navigate = useNavigate();
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState("");
  const [check, setCheck] = useState<{ parsed?: ParsedTomographyCsv; error?: string } | null>(null);

  const choose = async (f: File | null) => {
    setFile(f);
    setCheck(null);
    if (!f) return;
    if (f.size > LIMITS.uploadBytes) return setCheck({ error: `The file has ${f.size} bytes; at most ${LIMITS.uploadBytes} are accepted.` });
    try {
      setCheck({ parsed: parseTomographyCsv(await f.text()) });
      if (!name) setName(f.name.replace(/\.[^.]+$/, ""));
    } catch (e) {
      setCheck({ error: (e as Error).message });
    }
  };
  const send = async () => {
    if (!file) return;
    const run = await upload.mutateAsync({ file, name: name.trim() || undefined }).catch(() => null);
    if (run) navigate(labPaths.run(labId, run.id));
  };

  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        Columns <code>basis</code> and <code>counts</code>, optionally <code>seconds</code>, <code>singles_a</code>, <code>singles_b</code> and <code>monitor</code>; one row per
        setting; lines starting with # are comments. Comma, semicolon or tab separated.
      </p>
      <pre className="overflow-x-auto rounded bg-paper-sunk p-2 text-xs">{EXAMPLE}</pre>
      <Field label="Counts file (.csv)">
        {(p) => <input {...fieldProps(p)} type="file" accept=".csv,text/csv,text/plain" onChange={(e) => choose(e.target.files?.[0] ?? null)} className="text-sm" />}
      </Field>
      {check?.error && (
        <Alert kind="error" title="This file cannot be used as it is">
          {check.error}
          {/[.!?]$/.test(check.error) ? " " : ". "}Nothing was sent.
        </Alert>
      )}
      {check?.parsed && (
        <p className="text-sm text-success" role="status">
          Read {check.parsed.rows.length} rows for {check.parsed.photons} photon{check.parsed.photons === 1 ? "" : "s"}, columns {check.parsed.columns.join(", ")}.
        </p>
      )}
      <Field label="Run name" hint="Empty: the file name.">
        {(p) => <input {...fieldProps(p)} value={name} onChange={(e) => setName(e.target.value)} className={`${inputClass} max-w-md`} />}
      </Field>
      {upload.isError && (
        <Alert kind="error" title="The file was not stored">
          {upload.error.message} Nothing was saved.
        </Alert>
      )}
      <Button onClick={send} disabled={!check?.parsed || upload.isPending}>
        {upload.isPending ? "Uploading and reconstructing…" : "Upload and reconstruct"}
      </Button>
    </div>
  );
}
