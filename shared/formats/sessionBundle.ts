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
  const nul = pathOfNul(data);
  if (nul !== null) return { ok: false, problems: [{ field: nul || "bundle", message: "This text contains a NUL character (\\u0000), which cannot be stored; remove it." }] };
  const parsed = SessionBundleSchema.safeParse(data);
  if (parsed.success) return { ok: true, bundle: parsed.data };
  const problems = parsed.error.issues.slice(0, MAX_PROBLEMS).map((issue) => ({
    field: issue.path.length ? issue.path.map(String).join(".") : "bundle",
    message: issue.message,
  }));
  return { ok: false, problems };
}

/** Dotted path of the first string (or key) holding U+0000, which PostgreSQL cannot store; else null. */
function pathOfNul(value: unknown, path: string[] = []): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path.join(".") : null;
  if (!value || typeof value !== "object") return null;
  for (const [key, v] of Object.entries(value)) {
    if (key.includes("\u0000")) return [...path, key.replace(/\u0000/g, "\\u0000")].join(".");
    const found = pathOfNul(v, [...path, key]);
    if (found !== null) return found;
  }
  return null;
}

export function writeSessionBundle(bundle: SessionBundle): string {
  return JSON.stringify(bundle, null, 2) + "\n";
}

/** "session-pump-power-sweep-2025-03-14.rhomb.json" */
export function bundleFileName(title: string, date: string): string {
  const stem = title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "session";
  return `session-${stem}-${date}.rhomb.json`;
}
