/**
 * Reading and writing session bundles (layout: shared/schemas/bundle.ts). Reading never
 * throws: it answers either the validated bundle or every problem found, each naming the
 * field by its dotted path ("runs.2.revisions.0.rows.5.counts") — the words a person needs to
 * fix a hand-edited file.
 */
import { SessionBundleSchema, type SessionBundle } from "../schemas/bundle";

export type BundleProblem = { field: string; message: string };

export type BundleReadResult = { ok: true; bundle: SessionBundle } | { ok: false; problems: BundleProblem[] };

/** At most this many problems are listed; a file with more is usually not a bundle at all. */
const MAX_PROBLEMS = 50;

export function readSessionBundle(text: string): BundleReadResult {
  let data: unknown;
  try {
    data = JSON.parse(text.replace(/^\uFEFF/, ""));
  } catch (e) {
    return { ok: false, problems: [{ field: "bundle", message: `The file is not valid JSON (${(e as Error).message}).` }] };
  }
  const parsed = SessionBundleSchema.safeParse(data);
  if (parsed.success) return { ok: true, bundle: parsed.data };
  const problems = parsed.error.issues.slice(0, MAX_PROBLEMS).map((issue) => ({
    field: issue.path.length ? issue.path.map(String).join(".") : "bundle",
    message: issue.message,
  }));
  return { ok: false, problems };
}

export function writeSessionBundle(bundle: SessionBundle): string {
  return JSON.stringify(bundle, null, 2) + "\n";
}

/** "session-pump-power-sweep-2025-03-14.rhomb.json" */
export function bundleFileName(title: string, date: string): string {
  const stem = title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "session";
  return `session-${stem}-${date}.rhomb.json`;
}
