import { z } from "zod";
import { LIMITS } from "../limits";
import { EmailSchema } from "./auth";
import { HandednessSchema, AnalyserSchema, ArmCalibrationSchema } from "./labSessions";
import { PersonRefSchema, UuidSchema } from "./listing";
import { ReconstructionSchema } from "./reconstructions";
import { CountsRowSchema, RunConditionsSchema, RunKindSchema, SettingSetIdSchema } from "./runs";
import { BellTargetSchema } from "./sources";

/**
 * Shares open one item of a lab — a reconstruction, a run or a whole lab session — read-only to
 * people outside it: by a link with a secret token, or to a guest's e-mail address (who signs in
 * with an account for that address). Either can expire and be revoked at any time.
 */
export const ShareItemTypeSchema = z.enum(["reconstruction", "run", "session"], "Item type is reconstruction, run or session.");
export type ShareItemType = z.infer<typeof ShareItemTypeSchema>;

export const ShareKindSchema = z.enum(["link", "guest"], "Kind is link or guest.");
export type ShareKind = z.infer<typeof ShareKindSchema>;

/** Longest time a share may stay open before it must be renewed (a year). */
export const SHARE_MAX_DAYS = 366;

export const ShareParamsSchema = z.object({ labId: UuidSchema("Lab id"), shareId: UuidSchema("Share id") });
export const GuestShareParamsSchema = z.object({ shareId: UuidSchema("Share id") });

/** PostgreSQL text cannot hold U+0000; say so instead of failing on insert. */
const noNul = (s: string) => !s.includes("\u0000");
const NUL_MESSAGE = "This text contains a NUL character (\\u0000); remove it.";

const ShareTargetFields = {
  itemType: ShareItemTypeSchema,
  itemId: UuidSchema("Item id"),
  /** When the share stops working (ISO date-time); null = until revoked. */
  expiresAt: z.iso.datetime({ offset: true, message: "Expiry must be a date and time, e.g. 2030-01-31T18:00:00Z." }).nullable().default(null),
  /** A note for the lab's own list, e.g. "for the partner group's referee report". */
  label: z.string().trim().max(LIMITS.shortTextLength, `A label is at most ${LIMITS.shortTextLength} characters.`).refine(noNul, NUL_MESSAGE).default(""),
};

export const CreateShareSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("link"), ...ShareTargetFields }),
    z.object({
      kind: z.literal("guest"),
      ...ShareTargetFields,
      email: EmailSchema,
      /** A line added to the invitation e-mail. */
      message: z.string().trim().max(LIMITS.shortTextLength, `The message is at most ${LIMITS.shortTextLength} characters.`).refine(noNul, NUL_MESSAGE).default(""),
    }),
  ],
  "Kind is link (a secret link) or guest (an invitation by e-mail).",
);
export type CreateShare = z.infer<typeof CreateShareSchema>;

export const ShareListQuerySchema = z.object({
  itemType: ShareItemTypeSchema.optional(),
  itemId: UuidSchema("Item id").optional(),
});
export type ShareListQuery = z.infer<typeof ShareListQuerySchema>;

export const ShareStatusSchema = z.enum(["active", "expired", "revoked"]);
export type ShareStatus = z.infer<typeof ShareStatusSchema>;

/** A share as the lab sees it in its list (the link's secret is never shown again after creation). */
export const ShareSchema = z.object({
  id: z.string().uuid(),
  kind: ShareKindSchema,
  itemType: ShareItemTypeSchema,
  itemId: z.string().uuid(),
  /** The shared item's name as the lab knows it, e.g. "5 mW · maximum likelihood". */
  itemTitle: z.string(),
  label: z.string(),
  /** The guest's address (guest shares only). */
  email: z.string().nullable(),
  status: ShareStatusSchema,
  createdBy: PersonRefSchema,
  createdAt: z.string(),
  expiresAt: z.string().nullable(),
  revokedBy: PersonRefSchema,
  revokedAt: z.string().nullable(),
  openCount: z.number().int(),
  lastOpenedAt: z.string().nullable(),
});
export type ShareDto = z.infer<typeof ShareSchema>;

export const ShareListSchema = z.object({ data: z.array(ShareSchema) });

export const CreatedShareSchema = z.object({
  share: ShareSchema,
  /** Link shares: the address to hand out. Shown once; only its hash is stored. */
  link: z.object({ url: z.string(), token: z.string() }).nullable(),
  /** Guest shares: whether the invitation e-mail went out (the share is stored either way). */
  mail: z.object({ sent: z.boolean(), error: z.string().optional() }).nullable(),
});
export type CreatedShare = z.infer<typeof CreatedShareSchema>;

export const ShareTokenSchema = z.object({
  token: z.string().trim().min(20, "This link is incomplete: copy the whole address.").max(200, "This is not a Rhomb share link."),
});

/* ——— What a shared item shows: the snapshot (also the content of printable reports) ——— */

/** A reconstruction as shown outside the lab: results and parameters, no people and no lab ids. */
export const SnapshotReconstructionSchema = ReconstructionSchema.pick({
  id: true,
  revisionNumber: true,
  method: true,
  corrections: true,
  conventions: true,
  rho: true,
  eigenvalues: true,
  physical: true,
  metrics: true,
  uncertainties: true,
  fit: true,
  counts: true,
  warnings: true,
  engineVersion: true,
  createdAt: true,
});
export type SnapshotReconstruction = z.infer<typeof SnapshotReconstructionSchema>;

export const SnapshotRunSchema = z.object({
  id: z.string().uuid(),
  name: z.string(),
  kind: RunKindSchema,
  settingSetId: SettingSetIdSchema,
  notes: z.string(),
  conditions: RunConditionsSchema,
  /** The revision whose counts are shown (the current one, or the one the shared reconstruction used). */
  revisionNumber: z.number().int(),
  /** Corrections of the counts up to the shown revision (number ≥ 2), with their reasons. */
  countRevisions: z.array(z.object({ number: z.number().int(), reason: z.string(), createdAt: z.string() })),
  rows: z.array(CountsRowSchema),
  totalCounts: z.number(),
  createdAt: z.string(),
  /** Newest first; all of them use `revisionNumber`'s counts. */
  reconstructions: z.array(SnapshotReconstructionSchema),
});
export type SnapshotRun = z.infer<typeof SnapshotRunSchema>;

export const SnapshotSetupSchema = z.object({
  source: z.object({ name: z.string(), crystal: z.string(), pumpLaser: z.string(), wavelengthNm: z.number().nullable(), targetState: BellTargetSchema }),
  session: z.object({
    title: z.string(),
    date: z.string(),
    pumpWavelengthNm: z.number().nullable(),
    pumpPowerMw: z.number().nullable(),
    crystalTemperatureC: z.number().nullable(),
    coincidenceWindowNs: z.number().nullable(),
    detectors: z.string(),
    analyser: AnalyserSchema,
    calibration: z.array(ArmCalibrationSchema),
    handedness: HandednessSchema,
    /** The session's notes, or null when they are marked private. */
    notes: z.string().nullable(),
  }),
});

export const SnapshotSchema = z.object({
  itemType: ShareItemTypeSchema,
  title: z.string(),
  lab: z.object({ name: z.string(), institution: z.string() }),
  setup: SnapshotSetupSchema,
  runs: z.array(SnapshotRunSchema),
  /** The reconstruction a reconstruction share opens (null for run and session shares). */
  focusReconstructionId: z.string().uuid().nullable(),
  generatedAt: z.string(),
});
export type Snapshot = z.infer<typeof SnapshotSchema>;

export const SharedViewSchema = z.object({
  share: z.object({ kind: ShareKindSchema, createdAt: z.string(), expiresAt: z.string().nullable() }),
  snapshot: SnapshotSchema,
});
export type SharedViewDto = z.infer<typeof SharedViewSchema>;

/** What a guest sees in "Shared with me". */
export const GuestShareSchema = z.object({
  id: z.string().uuid(),
  itemType: ShareItemTypeSchema,
  itemTitle: z.string(),
  lab: z.object({ name: z.string(), institution: z.string() }),
  sharedBy: z.string(),
  status: ShareStatusSchema,
  createdAt: z.string(),
  expiresAt: z.string().nullable(),
});
export type GuestShareDto = z.infer<typeof GuestShareSchema>;
export const GuestShareListSchema = z.object({ data: z.array(GuestShareSchema) });
