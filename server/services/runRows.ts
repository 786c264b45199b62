import type { CountsRowDto } from "@shared/schemas/runs";
import type { CountsRow } from "@shared/physics/types";
import type { RowChange } from "../entities/RunRevision";

const FIELDS = ["setting", "counts", "seconds", "singlesA", "singlesB", "monitor"] as const;

/** Cell-by-cell differences between two revisions (0-based rows); added/removed rows as field "row". */
export function rowChanges(before: readonly CountsRowDto[], after: readonly CountsRowDto[]): RowChange[] {
  const changes: RowChange[] = [];
  const n = Math.max(before.length, after.length);
  for (let row = 0; row < n; row++) {
    const a = before[row];
    const b = after[row];
    if (!a || !b) {
      changes.push({ row, field: "row", from: a ?? null, to: b ?? null });
      continue;
    }
    for (const field of FIELDS) {
      if (JSON.stringify(a[field]) !== JSON.stringify(b[field])) changes.push({ row, field, from: a[field], to: b[field] });
    }
  }
  return changes;
}

export function totalCounts(rows: readonly CountsRowDto[]): number {
  return rows.reduce((sum, r) => sum + r.counts, 0);
}

/** Stored rows → the engine's rows, with per-row efficiencies when the reconstruction sets them. */
export function engineRows(rows: readonly CountsRowDto[], efficiencies: readonly number[] | null): CountsRow[] {
  return rows.map((r, i) => ({
    setting: r.setting,
    counts: r.counts,
    seconds: r.seconds,
    ...(r.singlesA !== null && { singlesA: r.singlesA }),
    ...(r.singlesB !== null && { singlesB: r.singlesB }),
    ...(r.monitor !== null && { monitor: r.monitor }),
    ...(efficiencies && { efficiency: efficiencies[i] }),
  }));
}
