import { describe, expect, it } from "vitest";
import type { Corrections, ReconstructionDto, ReconstructionMethod } from "@shared/schemas/reconstructions";
import { defaultReconstruction, reconstructionForMethod } from "../../src/features/runs/reconstructionChoice";

const RAW: Corrections = { accidentals: false, windowNs: null, efficiencies: null, drift: "none" };
const SUBTRACTED: Corrections = { accidentals: true, windowNs: 3, efficiencies: null, drift: "none" };

/** Only the fields the choice reads; the rest of a reconstruction does not matter here. */
const rec = (id: string, method: ReconstructionMethod, corrections: Corrections, createdAt: string, revisionNumber = 1) =>
  ({ id, method, corrections, createdAt, revisionNumber }) as ReconstructionDto;

// A saved run: linear and maximum likelihood on raw counts, then an accidental-subtracted
// maximum likelihood added later (what the demo's pump sweep has).
const list = [
  rec("mle-sub", "mle", SUBTRACTED, "2026-01-13T10:05:00Z"),
  rec("mle-raw", "mle", RAW, "2026-01-13T10:00:00Z"),
  rec("lin-raw", "linear", RAW, "2026-01-13T10:00:00Z"),
];

describe("the method switch of the run page", () => {
  it("opens on the newest maximum-likelihood reconstruction", () => {
    expect(defaultReconstruction(list, 1)?.id).toBe("mle-sub");
  });

  it("shows the raw linear estimate when no subtracted one exists, and comes back to the subtracted maximum likelihood", () => {
    const chosen = defaultReconstruction(list, 1)!;
    expect(reconstructionForMethod(list, 1, chosen, "linear")?.id).toBe("lin-raw");
    expect(reconstructionForMethod(list, 1, chosen, "mle")?.id).toBe("mle-sub");
  });

  it("keeps the chosen corrections when the other method has them", () => {
    const withLinear = [rec("lin-sub", "linear", SUBTRACTED, "2026-01-13T10:06:00Z"), ...list];
    const chosen = withLinear.find((r) => r.id === "mle-sub")!;
    expect(reconstructionForMethod(withLinear, 1, chosen, "linear")?.id).toBe("lin-sub");
    const raw = withLinear.find((r) => r.id === "mle-raw")!;
    expect(reconstructionForMethod(withLinear, 1, raw, "linear")?.id).toBe("lin-raw");
  });

  it("does not return to a reconstruction of older counts after a correction", () => {
    const corrected = [rec("mle-rev2", "mle", RAW, "2026-01-14T09:00:00Z", 2), rec("lin-rev2", "linear", RAW, "2026-01-14T09:00:00Z", 2), ...list];
    const chosenOld = corrected.find((r) => r.id === "mle-sub")!;
    expect(reconstructionForMethod(corrected, 2, chosenOld, "mle")?.id).toBe("mle-rev2");
  });
});
