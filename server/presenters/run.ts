import type { AttachmentDto, RunDetailDto, RunDto, RunRevisionDto } from "@shared/schemas/runs";
import type { LabRole } from "@shared/schemas/roles";
import type { Attachment } from "../entities/Attachment";
import type { RunRevision } from "../entities/RunRevision";
import { allowedActions } from "../policies/labAccess";
import type { RunDetail, RunSummary } from "../services/runQueries";
import { presentPerson } from "./person";
import { presentHeadline, presentReconstruction } from "./reconstruction";

/** Expects the run's session, its source and createdBy loaded (as runQueries does). */
export function presentRun({ run, rowCount, totalCounts, headline }: RunSummary, role: LabRole): RunDto {
  const session = run.session!;
  const source = session.source!;
  return {
    id: run.id,
    labId: run.labId,
    session: { id: session.id, title: session.title, date: session.date },
    source: { id: source.id, name: source.name, targetState: source.targetState },
    kind: run.kind,
    settingSetId: run.settingSetId,
    name: run.name,
    notes: run.notes,
    conditions: run.conditions,
    rowCount,
    totalCounts,
    revisionNumber: run.currentRevision,
    headline: headline ? presentHeadline(headline, source.targetState) : null,
    createdBy: presentPerson(run.createdBy),
    createdAt: run.createdAt.toISOString(),
    updatedAt: run.updatedAt.toISOString(),
    can: allowedActions(role),
  };
}

export function presentRunDetail(detail: RunDetail, role: LabRole): RunDetailDto {
  const numberOf = new Map(detail.revisions.map((r) => [r.id, r.number]));
  const current = detail.revisions.find((r) => r.number === detail.run.currentRevision)!;
  return {
    ...presentRun(detail, role),
    rows: current.rows,
    revisions: detail.revisions.map(presentRevision),
    reconstructions: detail.reconstructions.map((r) => presentReconstruction(r, numberOf.get(r.revisionId)!, role)),
    attachments: detail.attachments.map(presentAttachment),
  };
}

function presentRevision(r: RunRevision): RunRevisionDto {
  return { id: r.id, number: r.number, reason: r.reason, changes: r.changes, rows: r.rows, createdBy: presentPerson(r.createdBy), createdAt: r.createdAt.toISOString() };
}

export function presentAttachment(a: Attachment): AttachmentDto {
  return {
    id: a.id,
    runId: a.runId,
    fileName: a.fileName,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    sha256: a.sha256,
    downloadPath: `/api/labs/${a.labId}/attachments/${a.id}`,
    createdBy: presentPerson(a.createdBy),
    createdAt: a.createdAt.toISOString(),
  };
}
