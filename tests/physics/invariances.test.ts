/**
 * Symmetries the numbers must respect (physics.md §1, §6).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { figuresOfMerit, reconstruct, simulateCounts, standardSet, type DensityMatrix } from "@shared/physics";
import { fromPlain, kron, multiply, adjoint, toPlain, type CMatrix } from "@shared/physics/linalg/complexMatrix";
import { concurrence } from "@shared/physics/entanglement";
import { arbitraryState, conjugateOf, maxAbsDiff, werner } from "./support/states";

/** A random single-qubit unitary from three angles (ZYZ Euler decomposition; Nielsen & Chuang Thm 4.1). */
function unitary2(a: number, b: number, c: number): CMatrix {
  const cos = Math.cos(b / 2);
  const sin = Math.sin(b / 2);
  const e = (t: number) => [Math.cos(t), Math.sin(t)];
  const [p, q] = e(-(a + c) / 2);
  const [r, s] = e(-(a - c) / 2);
  const [u, v] = e((a - c) / 2);
  const [w, x] = e((a + c) / 2);
  return { n: 2, re: Float64Array.of(p * cos, -r * sin, u * sin, w * cos), im: Float64Array.of(q * cos, -s * sin, v * sin, x * cos) };
}

describe("the handedness setting (physics.md §1)", () => {
  it("swapping R and L conjugates ρ and leaves real-target fidelities, concurrence, purity, entropies, negativity and CHSH unchanged", () => {
    // A state with complex coherences, so that conjugation is visible
    const truth: DensityMatrix = {
      re: [[0.05, 0.02, 0.01, 0.03], [0.02, 0.45, -0.3, 0.01], [0.01, -0.3, 0.45, 0.02], [0.03, 0.01, 0.02, 0.05]],
      im: [[0, 0.01, -0.02, 0.01], [-0.01, 0, 0.2, -0.01], [0.02, -0.2, 0, 0.01], [-0.01, 0.01, -0.01, 0]],
    };
    const rows = simulateCounts({ rho: truth, settings: standardSet("tomo36").labels, pairRate: 5000, seed: 19 });
    for (const method of ["linear", "mle", "projected"] as const) {
      const plus = reconstruct({ rows, conventions: { handedness: "R=H+iV" } }, { method });
      const minus = reconstruct({ rows, conventions: { handedness: "R=H-iV" } }, { method });
      expect(maxAbsDiff(minus.rho, conjugateOf(plus.rho))).toBeLessThan(1e-9);
      expect(Math.max(...plus.rho.im.flat().map(Math.abs))).toBeGreaterThan(0.05);
      for (const target of ["phi+", "phi-", "psi+", "psi-"] as const) {
        const a = figuresOfMerit(plus.rho, target);
        const b = figuresOfMerit(minus.rho, target);
        for (const key of ["fidelity", "concurrence", "tangle", "purity", "linearEntropy", "vonNeumannEntropy", "negativity", "chshMax"] as const) {
          expect(b[key]).toBeCloseTo(a[key]!, 9);
        }
      }
      if (plus.logLikelihood !== null) expect(minus.logLikelihood).toBeCloseTo(plus.logLikelihood, 6);
    }
  });
});

describe("local unitaries (entanglement monotones are invariant, Wootters PRL 80, 2245 (1998); Vidal & Werner 2002)", () => {
  const angle = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });
  it("(U_A ⊗ U_B) ρ (U_A ⊗ U_B)† keeps concurrence, negativity, CHSH maximum, purity and entropy", () => {
    fc.assert(
      fc.property(arbitraryState(4), fc.tuple(angle, angle, angle, angle, angle, angle), (rho, [a1, b1, c1, a2, b2, c2]) => {
        const u = kron(unitary2(a1, b1, c1), unitary2(a2, b2, c2));
        const m = fromPlain(rho);
        const rotated = toPlain(multiply(multiply(u, m), adjoint(u)));
        const before = figuresOfMerit(rho, null);
        const after = figuresOfMerit(rotated, null);
        expect(after.concurrence).toBeCloseTo(before.concurrence!, 9);
        expect(after.negativity).toBeCloseTo(before.negativity!, 9);
        expect(after.chshMax).toBeCloseTo(before.chshMax!, 9);
        expect(after.purity).toBeCloseTo(before.purity, 12);
        expect(after.vonNeumannEntropy).toBeCloseTo(before.vonNeumannEntropy, 9);
      }),
      { numRuns: 60, seed: 23 },
    );
  });

  it("concurrence is invariant while fidelity to a fixed Bell state is not (the check can fail)", () => {
    const rho = werner(0.9);
    const u = kron(unitary2(0.3, 1.1, -0.4), unitary2(0, 0, 0));
    const rotated = toPlain(multiply(multiply(u, fromPlain(rho)), adjoint(u)));
    expect(concurrence(fromPlain(rotated), true)).toBeCloseTo(concurrence(fromPlain(rho), true), 12);
    expect(Math.abs(figuresOfMerit(rotated, "psi-").fidelity! - figuresOfMerit(rho, "psi-").fidelity!)).toBeGreaterThan(0.05);
  });
});
