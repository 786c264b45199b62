import { useState } from "react";
import { Link } from "react-router-dom";
import { BUNDLE_LIMITS } from "@shared/schemas/bundle";
import { ApiError } from "../../api/client";
import { useImportBundle } from "../../api/shares";
import { useSources } from "../../api/sources";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { labPaths } from "../notebook/labPaths";

/** Imports a session bundle (.rhomb.json) as a new session: all of it, or nothing and every problem listed. */
export function ImportBundleForm({ labId }: { labId: string }) {
  const importBundle = useImportBundle(labId);
  const sources = useSources(labId, { pageSize: 100, sort: "name", order: "asc" });
  const [file, setFile] = useState<File | null>(null);
  const [sourceId, setSourceId] = useState("");
  const [tooBig, setTooBig] = useState(false);
  const problems = importBundle.error instanceof ApiError && Array.isArray(importBundle.error.details) ? (importBundle.error.details as Array<{ field: string; message: string }>) : [];
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (file) importBundle.mutate({ file, sourceId: sourceId || undefined });
  };
  const done = importBundle.data;
  return (
    <form onSubmit={submit} noValidate className="max-w-2xl space-y-4">
      <Field label="Session bundle" hint={`A .rhomb.json file exported from a session (Export ▾ → Whole session as a bundle), at most ${BUNDLE_LIMITS.bytes / 1_000_000} MB.`} error={tooBig ? "This file is larger than a bundle can be." : undefined}>
        {(p) => (
          <input
            {...fieldProps(p)}
            type="file"
            accept=".json,application/json"
            className={inputClass}
            onChange={(e) => {
              const f = e.target.files?.[0] ?? null;
              setTooBig(!!f && f.size > BUNDLE_LIMITS.bytes);
              setFile(f);
              importBundle.reset();
            }}
          />
        )}
      </Field>
      <Field label="Put it under the source" hint="By default the bundle's own source: the lab's source of the same name, or a new one.">
        {(p) => (
          <select {...fieldProps(p)} className={inputClass} value={sourceId} onChange={(e) => setSourceId(e.target.value)}>
            <option value="">The bundle's source</option>
            {sources.data?.data.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Button type="submit" disabled={!file || tooBig || importBundle.isPending}>
        {importBundle.isPending ? "Importing…" : "Import the session"}
      </Button>
      {importBundle.isError && (
        <Alert kind="error" title="Nothing was imported">
          <p>{problems.length ? `The bundle has ${problems.length === 1 ? "a problem" : `${problems.length} problems`}:` : importBundle.error.message}</p>
          {problems.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {problems.map((d) => (
                <li key={d.field + d.message}>
                  <code>{d.field}</code>: {d.message}
                </li>
              ))}
            </ul>
          )}
        </Alert>
      )}
      {done && (
        <Alert kind="success" title="Imported">
          Session “{done.session.title}” with {done.runs} runs, {done.revisions} count revisions, {done.reconstructions} reconstructions and {done.attachments} files, under the source {done.source.name}
          {done.source.created ? " (new)" : ""}.{" "}
          <Link className="font-bold text-petrol-700 underline" to={labPaths.session(labId, done.session.id)}>
            Open the session
          </Link>
        </Alert>
      )}
    </form>
  );
}
