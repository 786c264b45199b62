import { z } from "zod";
import { LIMITS } from "../limits";
import { CreateLabSessionSchema } from "./labSessions";
import { MatrixSchema, MetricsSchema, ReconstructionSchema } from "./reconstructions";
import { CreateRunSchema, RowChangeSchema, RowsSchema, RunConditionsSchema, RunKindSchema, SettingSetIdSchema } from "./runs";
import { CreateSourceSchema } from "./sources";

/**
 * A session bundle: one lab session with everything needed to rebuild it in another lab —
 * source, setup, every run with every revision of its raw rows, every reconstruction with its
 * parameters and results, and the uploaded files. Our own layout ("rhomb-session-bundle",
 * version 1), documented in README "Sharing and exports". People appear in it only as the
 * session's `people` list; accounts, e-mail addresses and ids of the lab are never written.
 */
export const BUNDLE_FORMAT = "rhomb-session-bundle";
export const BUNDLE_VERSION = 1;

export const BUNDLE_LIMITS = {
  /** The whole bundle file, bytes (attachments travel base64-encoded inside it). */
  bytes: 40_000_000,
  runs: 500,
  revisionsPerRun: 200,
  reconstructionsPerRun: 200,
  attachmentsPerRun: 20,
} as const;

const isoTime = z.iso.datetime({ offset: true, message: "Must be a date and time (ISO 8601)." });

export const BundleSourceSchema = CreateSourceSchema;

/** The setup of the session (its source travels beside it, not as an id); omitted fields take the defaults of a new session. */
export const BundleSessionSchema = CreateLabSessionSchema.omit({ sourceId: true });

export const BundleRevisionSchema = z.object({
  number: z.number().int().min(1, "Revision numbers start at 1."),
  rows: RowsSchema,
  reason: z.string().max(LIMITS.shortTextLength),
  changes: z.array(RowChangeSchema),
  createdAt: isoTime,
});

export const BundleReconstructionSchema = z.object({
  /** Which revision's counts it used. */
  revisionNumber: z.number().int().min(1),
  ...ReconstructionSchema.pick({ method: true, corrections: true, conventions: true, eigenvalues: true, physical: true, warnings: true }).shape,
  fit: z.object({
    logLikelihood: z.number().nullable(),
    iterations: z.number().int().min(0, "Iterations cannot be negative.").nullable(),
    converged: z.boolean().nullable(),
    tolerance: z.number().positive("The tolerance must be above 0.").nullable(),
  }),
  counts: z.object({ total: z.number().min(0, "Total counts cannot be negative."), clippedRows: z.array(z.number().int().min(0)) }),
  rho: MatrixSchema,
  metrics: MetricsSchema,
  uncertainties: z
    .object({ samples: z.number().int().min(1).max(LIMITS.monteCarloMax), seed: z.number().int().min(0).max(2 ** 31 - 1), metrics: MetricsSchema, rho: MatrixSchema })
    .nullable(),
  engineVersion: z.string().min(1).max(40),
  createdAt: isoTime,
});

export const BundleAttachmentSchema = z.object({
  fileName: z.string().min(1).max(255),
  contentType: z.string().min(1).max(255),
  sizeBytes: z.number().int().min(0).max(LIMITS.uploadBytes),
  sha256: z.string().regex(/^[0-9a-f]{64}$/, "sha256 is 64 lower-case hex digits."),
  contentBase64: z.base64("Content must be base64."),
  createdAt: isoTime,
});

export const BundleRunSchema = z.object({
  name: CreateRunSchema.shape.name,
  kind: RunKindSchema,
  settingSetId: SettingSetIdSchema,
  notes: z.string("Notes are text (\"\" for none).").max(LIMITS.notesLength).default(""),
  conditions: RunConditionsSchema.default({ pumpPowerMw: null, crystalTemperatureC: null, compensatorTiltDeg: null }),
  currentRevision: z.number("Say which revision is current (currentRevision, a number).").int().min(1),
  createdAt: isoTime,
  revisions: z.array(BundleRevisionSchema, "A run lists its revisions of counts (revisions: [ … ]).").min(1, "A run needs at least one revision of counts.").max(BUNDLE_LIMITS.revisionsPerRun),
  /** Oldest first (the order they were made in). */
  reconstructions: z.array(BundleReconstructionSchema, "reconstructions is a list ([] for none).").max(BUNDLE_LIMITS.reconstructionsPerRun).default([]),
  attachments: z.array(BundleAttachmentSchema, "attachments is a list ([] for none).").max(BUNDLE_LIMITS.attachmentsPerRun).default([]),
});
export type BundleRun = z.infer<typeof BundleRunSchema>;

export const SessionBundleSchema = z
  .object({
    format: z.literal(BUNDLE_FORMAT, `This is not a Rhomb session bundle (format must be "${BUNDLE_FORMAT}").`),
    formatVersion: z.literal(BUNDLE_VERSION, `This Rhomb reads session bundles of version ${BUNDLE_VERSION}.`),
    exportedAt: isoTime,
    source: BundleSourceSchema,
    session: BundleSessionSchema,
    runs: z.array(BundleRunSchema, "runs is a list of the session's runs ([] for none).").max(BUNDLE_LIMITS.runs, `At most ${BUNDLE_LIMITS.runs} runs per bundle.`),
  })
  .superRefine((bundle, ctx) => bundle.runs.forEach((run, i) => checkRun(run, ["runs", i], ctx)));
export type SessionBundle = z.infer<typeof SessionBundleSchema>;
export type SessionBundleInput = z.input<typeof SessionBundleSchema>;

/** What the pieces of one run say about each other: revisions 1…n, references, matrix sizes. */
function checkRun(run: BundleRun, at: (string | number)[], ctx: z.RefinementCtx): void {
  const numbers = run.revisions.map((r) => r.number);
  numbers.forEach((n, j) => {
    if (n !== j + 1) ctx.addIssue({ code: "custom", path: [...at, "revisions", j, "number"], message: `Revisions are numbered 1, 2, 3… in order; this one should be ${j + 1}, not ${n}.` });
  });
  if (!numbers.includes(run.currentRevision)) ctx.addIssue({ code: "custom", path: [...at, "currentRevision"], message: `The run has no revision ${run.currentRevision}.` });
  run.revisions.forEach((revision, j) => {
    // Rows of a standard set must still fit that set, exactly as when the run was recorded.
    const check = CreateRunSchema.safeParse({ kind: run.kind, settingSetId: run.settingSetId, name: run.name, rows: revision.rows });
    if (!check.success) for (const issue of check.error.issues) ctx.addIssue({ code: "custom", path: [...at, "revisions", j, ...issue.path.map((p) => (typeof p === "symbol" ? String(p) : p))], message: issue.message });
  });
  run.reconstructions.forEach((rec, k) => {
    const here = [...at, "reconstructions", k];
    if (!numbers.includes(rec.revisionNumber)) ctx.addIssue({ code: "custom", path: [...here, "revisionNumber"], message: `The run has no revision ${rec.revisionNumber}.` });
    const d = rec.rho.re.length;
    const square = (m: { re: number[][]; im: number[][] }) => m.re.length === d && m.im.length === d && [...m.re, ...m.im].every((row) => row.length === d);
    if (d < 2 || (d & (d - 1)) !== 0 || !square(rec.rho)) ctx.addIssue({ code: "custom", path: [...here, "rho"], message: "ρ must be square (re and im alike) with a side of 2, 4, 8 or 16." });
    else if (rec.uncertainties && !square(rec.uncertainties.rho)) ctx.addIssue({ code: "custom", path: [...here, "uncertainties", "rho"], message: `σ(ρ) must be ${d} × ${d}, like ρ.` });
    if (rec.eigenvalues.length !== d) ctx.addIssue({ code: "custom", path: [...here, "eigenvalues"], message: `ρ is ${d} × ${d}, so it has ${d} eigenvalues, not ${rec.eigenvalues.length}.` });
  });
}
