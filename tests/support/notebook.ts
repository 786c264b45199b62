import { writeTomographyCsv } from "@shared/formats/tomographyCsv";
import { simulateCounts, standardSet } from "@shared/physics";
import type { CountsRowInput } from "@shared/schemas/runs";
import { wernerLike } from "../../server/db/seeds/demoStates";
import type { LabFixture } from "./clients";

/** A source and a lab session (3 ns window, ideal plates) in the fixture's lab, made by its member. */
export async function sessionIn(f: LabFixture, over: object = {}): Promise<{ sourceId: string; sessionId: string }> {
  const lab = f.lab.id;
  const sourceId = (await f.clients.member.post(`/api/labs/${lab}/sources`, { name: `Source ${Math.random().toString(36).slice(2, 8)}` }).expect(201)).body.id;
  const sessionId = (await f.clients.member.post(`/api/labs/${lab}/sessions`, { sourceId, title: "Test session", date: "2026-03-02", coincidenceWindowNs: 3, ...over }).expect(201)).body.id;
  return { sourceId, sessionId };
}

/**
 * 16-setting counts of the Werner state p·ψ⁻ + (1−p)·I/4 with Poisson noise (fixed seed), with
 * singles so that accidental subtraction can be switched on.
 */
export function psiMinusRows(options: { p?: number; pairRate?: number; seed?: number; singles?: boolean } = {}): CountsRowInput[] {
  const rows = simulateCounts({
    rho: wernerLike(options.p ?? 0.95),
    settings: standardSet("tomo16").labels,
    pairRate: options.pairRate ?? 20_000,
    seconds: 1,
    seed: options.seed ?? 7,
    ...(options.singles !== false && { singles: { rateA: 60_000, rateB: 60_000, windowNs: 3 } }),
  });
  return rows.map((r) => ({ setting: r.setting as string, counts: r.counts, seconds: r.seconds ?? 1, singlesA: r.singlesA ?? null, singlesB: r.singlesB ?? null }));
}

/** The same rows as our counts CSV (shared/formats/tomographyCsv.ts), for upload tests. */
export function psiMinusCsv(options: Parameters<typeof psiMinusRows>[0] = {}, comments: string[] = []): string {
  const rows = psiMinusRows(options).map((r) => ({ setting: r.setting as string, counts: r.counts, seconds: r.seconds, singlesA: r.singlesA ?? undefined, singlesB: r.singlesB ?? undefined }));
  return writeTomographyCsv(rows, comments);
}
