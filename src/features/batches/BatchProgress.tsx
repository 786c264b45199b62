import { useState } from "react";
import { Link } from "react-router-dom";
import type { BatchDto, BatchFileDto, BatchFileStatus } from "@shared/schemas/batches";
import { Alert } from "../../components/Alert";
import { DataTable, type Column } from "../../components/DataTable";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { labPaths } from "../notebook/labPaths";
import { BatchStatusBadge, STATUS_LOOK } from "./BatchStatusBadge";

type Filter = "all" | "open" | BatchFileStatus;

/** A batch while it runs and after: a progress bar, counts by status, and a row per file. */
export function BatchProgress({ batch }: { batch: BatchDto }) {
  const [filter, setFilter] = useState<Filter>("all");
  const c = batch.counts;
  const finished = c.stored + c.failed + c.duplicate;
  const percent = Math.round((100 * finished) / Math.max(batch.fileCount, 1));
  const shown = batch.files.filter((f) => filter === "all" || (filter === "open" ? f.status === "queued" || f.status === "processing" : f.status === filter));
  return (
    <div className="space-y-4">
      <div>
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <p className="font-bold text-ink" id={`progress-${batch.id}`}>
            {batch.done ? "Batch finished" : "Processing the batch"} — {finished.toLocaleString("en")} of {batch.fileCount.toLocaleString("en")} {batch.fileCount === 1 ? "file" : "files"} done
          </p>
          <p className="num text-sm text-ink-soft">{percent} %</p>
        </div>
        <div
          role="progressbar"
          aria-labelledby={`progress-${batch.id}`}
          aria-valuemin={0}
          aria-valuemax={batch.fileCount}
          aria-valuenow={finished}
          className="mt-2 flex h-4 w-full overflow-hidden rounded-full bg-paper-sunk"
        >
          {/* Segments by outcome; each also has its count in words below. */}
          <div className="bg-success" style={{ width: `${(100 * c.stored) / batch.fileCount}%` }} />
          <div className="bg-caution-edge" style={{ width: `${(100 * c.duplicate) / batch.fileCount}%` }} />
          <div className="bg-danger" style={{ width: `${(100 * c.failed) / batch.fileCount}%` }} />
          <div className="animate-pulse bg-petrol-500" style={{ width: `${(100 * c.processing) / batch.fileCount}%` }} />
        </div>
        <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-soft" aria-label="Files by status">
          {(["stored", "duplicate", "failed", "processing", "queued"] as const).map((s) => (
            <li key={s}>
              <span aria-hidden="true">{STATUS_LOOK[s].glyph}</span> {STATUS_LOOK[s].label}: <span className="num font-bold text-ink">{c[s].toLocaleString("en")}</span>
            </li>
          ))}
        </ul>
      </div>
      {batch.done && <Outcome batch={batch} />}
      <SegmentedToggle<Filter>
        label="Show"
        value={filter}
        onChange={setFilter}
        options={[
          { value: "all", label: `All (${batch.fileCount})` },
          { value: "failed", label: `Not stored (${c.failed})`, disabled: c.failed === 0 },
          { value: "duplicate", label: `Already stored (${c.duplicate})`, disabled: c.duplicate === 0 },
          { value: "stored", label: `Stored (${c.stored})`, disabled: c.stored === 0 },
          { value: "open", label: `Waiting (${c.queued + c.processing})`, disabled: c.queued + c.processing === 0 },
        ]}
      />
      <DataTable caption="Files of this batch" captionHidden columns={columns(batch.labId)} rows={shown} rowKey={(f) => f.id} />
    </div>
  );
}

function Outcome({ batch }: { batch: BatchDto }) {
  const c = batch.counts;
  if (c.failed === 0) {
    return (
      <Alert kind="success" title={batch.fileCount === 1 ? "The file is in the session" : `All ${batch.fileCount} files are in the session`}>
        {c.stored} stored as {c.stored === 1 ? "a new run" : "new runs"}
        {c.duplicate ? `, ${c.duplicate} ${c.duplicate === 1 ? "was" : "were"} already stored and not stored again` : ""}.
      </Alert>
    );
  }
  const others = [c.stored && (c.stored === 1 ? "the other one was stored as a new run" : `the other ${c.stored} were stored as new runs`), c.duplicate && `${c.duplicate} had been stored before and ${c.duplicate === 1 ? "was" : "were"} not stored again`].filter(Boolean).join("; ");
  return (
    <Alert kind="caution" title={`${c.failed} of ${batch.fileCount} files ${c.failed === 1 ? "was" : "were"} not stored`}>
      {c.failed === 1 ? "It says below what is wrong (file, row and column); none of it was stored" : "Each one says below what is wrong (file, row and column); none of them was stored"}
      {others ? ` — ${others}` : ""}. Fix {c.failed === 1 ? "it" : "them"} and upload the whole set again: files already stored are recognised and skipped.
    </Alert>
  );
}

function columns(labId: string): Column<BatchFileDto>[] {
  return [
    { key: "n", header: "#", numeric: true, render: (f) => f.position + 1 },
    { key: "file", header: "File", render: (f) => <span className="break-all font-bold text-ink">{f.fileName}</span> },
    { key: "status", header: "Status", render: (f) => <BatchStatusBadge status={f.status} /> },
    { key: "result", header: "Result", render: (f) => <Result labId={labId} file={f} /> },
  ];
}

function Result({ labId, file }: { labId: string; file: BatchFileDto }) {
  if (file.status === "stored") {
    return file.run ? (
      <>
        <Link className="font-bold text-petrol-700 underline" to={labPaths.run(labId, file.run.id)}>
          Run “{file.run.name}”
        </Link>
        {file.message && <span className="block text-sm text-caution">{file.message}</span>}
      </>
    ) : (
      <span className="text-ink-faint">Stored (the run was deleted since)</span>
    );
  }
  if (file.status === "duplicate") {
    return (
      <span className="text-ink-soft">
        Same content as{" "}
        {file.duplicateOf ? (
          <Link className="font-bold text-petrol-700 underline" to={labPaths.run(labId, file.duplicateOf.id)}>
            run “{file.duplicateOf.name}”
          </Link>
        ) : (
          "a stored run"
        )}
        ; not stored again
      </span>
    );
  }
  if (file.status === "failed") {
    return (
      <ul className="space-y-0.5 text-danger">
        {file.issues.map((i, k) => (
          <li key={k}>
            {[i.row !== null && `row ${i.row}`, i.column && `column “${i.column}”`].filter(Boolean).join(", ")}
            {(i.row !== null || i.column) && ": "}
            {i.message}
          </li>
        ))}
      </ul>
    );
  }
  return <span className="text-ink-faint">{file.status === "processing" ? `Reconstructing (attempt ${file.attempts})…` : "Waiting for a worker"}</span>;
}
