/**
 * Figures of merit against closed forms from the literature (physics contract §6).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { chshFromRho, figuresOfMerit, STANDARD_BELL_ANGLES, uhlmannFidelity, fidelityToTarget, phaseOptimisedFidelity } from "@shared/physics";
import { fromPlain } from "@shared/physics/linalg/complexMatrix";
import { concurrence } from "@shared/physics/entanglement";
import { pure, werner } from "./support/states";

const S = Math.SQRT1_2;

describe("Werner states ρ = p|ψ⁻⟩⟨ψ⁻| + (1−p) I/4 — Werner, Phys. Rev. A 40, 4277 (1989); closed forms in physics.md §6", () => {
  for (const p of [0, 0.2, 1 / 3, 0.5, 0.8, 0.95, 1]) {
    it(`p = ${p.toFixed(3)}`, () => {
      const f = figuresOfMerit(werner(p), "psi-");
      expect(f.fidelity).toBeCloseTo((1 + 3 * p) / 4, 12);
      // Wootters, PRL 80, 2245 (1998) applied to Werner states: C = max(0, (3p − 1)/2)
      expect(f.concurrence).toBeCloseTo(Math.max(0, (3 * p - 1) / 2), 12);
      expect(f.tangle).toBeCloseTo(Math.max(0, (3 * p - 1) / 2) ** 2, 12);
      // Horodecki, Horodecki, Horodecki, Phys. Lett. A 200, 340 (1995): T = −p·I, so 2√(2p²)
      expect(f.chshMax).toBeCloseTo(2 * Math.SQRT2 * p, 12);
      expect(f.purity).toBeCloseTo((1 + 3 * p * p) / 4, 12);
      // Vidal & Werner, Phys. Rev. A 65, 032314 (2002): negativity max(0, (3p − 1)/4)
      expect(f.negativity).toBeCloseTo(Math.max(0, (3 * p - 1) / 4), 12);
      // linear entropy normalised by d/(d − 1) = 4/3, so the maximally mixed state gives 1 (from memory)
      expect(f.linearEntropy).toBeCloseTo((4 / 3) * (1 - (1 + 3 * p * p) / 4), 12);
      // eigenvalues (1+3p)/4 and (1−p)/4 (three times): von Neumann entropy in bits
      const a = (1 + 3 * p) / 4;
      const b = (1 - p) / 4;
      const h = (x: number) => (x > 0 ? -x * Math.log2(x) : 0);
      expect(f.vonNeumannEntropy).toBeCloseTo(h(a) + 3 * h(b), 12);
      expect(f.physical).toBe(true);
    });
  }

  it("Uhlmann fidelity of two Werner states equals the classical fidelity of their commuting spectra (Jozsa, J. Mod. Opt. 41, 2315 (1994))", () => {
    const [p, q] = [0.9, 0.4];
    const a = (x: number) => (1 + 3 * x) / 4;
    const b = (x: number) => (1 - x) / 4;
    const expected = (Math.sqrt(a(p) * a(q)) + 3 * Math.sqrt(b(p) * b(q))) ** 2;
    expect(uhlmannFidelity(fromPlain(werner(p)), fromPlain(werner(q)))).toBeCloseTo(expected, 12);
    expect(fidelityToTarget(fromPlain(werner(p)), { kind: "density", rho: werner(q) })).toBeCloseTo(expected, 12);
  });
});

describe("Bell states — Tsirelson bound (Lett. Math. Phys. 4, 93 (1980)) and maximal entanglement", () => {
  const bell = {
    "phi+": pure([S, 0, 0, S]),
    "phi-": pure([S, 0, 0, -S]),
    "psi+": pure([0, S, S, 0]),
    "psi-": pure([0, S, -S, 0]),
  } as const;
  for (const [name, rho] of Object.entries(bell)) {
    it(`${name}: F = 1, C = 1, tangle 1, CHSH maximum 2√2, negativity 1/2, purity 1, entropy 0`, () => {
      const f = figuresOfMerit(rho, name as keyof typeof bell);
      expect(f.fidelity).toBeCloseTo(1, 12);
      expect(f.concurrence).toBeCloseTo(1, 12);
      expect(f.tangle).toBeCloseTo(1, 12);
      expect(f.chshMax).toBeCloseTo(2 * Math.SQRT2, 12);
      expect(f.negativity).toBeCloseTo(0.5, 12);
      expect(f.purity).toBeCloseTo(1, 12);
      expect(f.vonNeumannEntropy).toBeCloseTo(0, 12);
      expect(f.phaseOptimised!.fidelity).toBeCloseTo(1, 12);
    });
  }

  it("φ⁺ gives S = 2√2 at a = 0°, a′ = 45°, b = 22.5°, b′ = 67.5° (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969))", () => {
    expect(chshFromRho(bell["phi+"], STANDARD_BELL_ANGLES)).toBeCloseTo(2 * Math.SQRT2, 12);
    // ψ⁻ is anti-correlated in every linear basis, E = −cos 2(α − β): S = −2√2 at the same angles
    expect(chshFromRho(bell["psi-"], STANDARD_BELL_ANGLES)).toBeCloseTo(-2 * Math.SQRT2, 12);
    // a product state |HH⟩: E(α, β) = cos 2α cos 2β, S = 1·(cos45° − cos135°) + 0 = √2 (direct calculation)
    expect(chshFromRho(pure([1, 0, 0, 0]), STANDARD_BELL_ANGLES)).toBeCloseTo(Math.SQRT2, 12);
  });
});

describe("Wootters concurrence, PRL 80, 2245 (1998)", () => {
  it("a|HH⟩ + b|VV⟩ has C = 2|ab| (pure states: C = |⟨ψ|σy⊗σy|ψ*⟩|, Wootters Eq. (2)) and negativity |ab| (Vidal & Werner 2002)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (theta, phase) => {
        const a = Math.cos(theta);
        const b = Math.sin(theta);
        const rho = pure([a, 0, 0, b * Math.cos(phase)], [0, 0, 0, b * Math.sin(phase)]);
        const f = figuresOfMerit(rho, null);
        expect(f.concurrence).toBeCloseTo(2 * Math.abs(a * b), 9);
        expect(f.negativity).toBeCloseTo(Math.abs(a * b), 9);
      }),
      { numRuns: 60, seed: 42 },
    );
  });

  it("product states have C = 0 and negativity 0 (separable: Peres, PRL 77, 1413 (1996))", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 8, maxLength: 8 }).filter((v) => Math.hypot(v[0], v[1], v[2], v[3]) > 0.1 && Math.hypot(v[4], v[5], v[6], v[7]) > 0.1), (v) => {
        // (α|H⟩ + β|V⟩) ⊗ (γ|H⟩ + δ|V⟩) with complex α, β, γ, δ
        const [ar, ai, br, bi, cr, ci, dr, di] = v;
        const mul = (xr: number, xi: number, yr: number, yi: number) => [xr * yr - xi * yi, xr * yi + xi * yr];
        const amps = [mul(ar, ai, cr, ci), mul(ar, ai, dr, di), mul(br, bi, cr, ci), mul(br, bi, dr, di)];
        const f = figuresOfMerit(pure(amps.map((x) => x[0]), amps.map((x) => x[1])), null);
        expect(f.concurrence).toBeCloseTo(0, 9);
        expect(f.negativity).toBeCloseTo(0, 9);
      }),
      { numRuns: 60, seed: 9 },
    );
  });

  it("the non-physical route (eigenvalues of ρρ̃) agrees with the physical one on physical states", () => {
    for (const p of [0.2, 0.6, 0.9]) {
      const m = fromPlain(werner(p));
      expect(concurrence(m, false)).toBeCloseTo(concurrence(m, true), 9);
    }
  });
});

describe("entropies and purity", () => {
  it("the maximally mixed two-qubit state: purity 1/4, linear entropy 1, von Neumann entropy 2 bits", () => {
    const f = figuresOfMerit(werner(0), null);
    expect(f.purity).toBeCloseTo(0.25, 14);
    expect(f.linearEntropy).toBeCloseTo(1, 14);
    expect(f.vonNeumannEntropy).toBeCloseTo(2, 14);
  });

  it("one qubit: linear entropy uses d/(d−1) = 2, so I/2 gives 1; two-qubit measures are null", () => {
    const f = figuresOfMerit({ re: [[0.5, 0], [0, 0.5]], im: [[0, 0], [0, 0]] }, null);
    expect(f.linearEntropy).toBeCloseTo(1, 14);
    expect(f.vonNeumannEntropy).toBeCloseTo(1, 14);
    expect(f.concurrence).toBeNull();
    expect(f.chshMax).toBeNull();
  });
});

describe("fidelity to pure and custom targets (Jozsa 1994: F = ⟨ψ|ρ|ψ⟩)", () => {
  it("a custom state vector equals the Bell target it spells out, normalised or not", () => {
    const rho = werner(0.7);
    const f1 = fidelityToTarget(fromPlain(rho), "psi-");
    const f2 = fidelityToTarget(fromPlain(rho), { kind: "vector", vector: { re: [0, 2, -2, 0], im: [0, 0, 0, 0] } });
    expect(f2).toBeCloseTo(f1, 14);
    expect(f1).toBeCloseTo((1 + 3 * 0.7) / 4, 14);
  });

  it("a pure density-matrix target gives the same as its vector (Uhlmann reduces to ⟨ψ|ρ|ψ⟩)", () => {
    const rho = fromPlain(werner(0.5));
    const target = pure([0.3, 0.5, -0.2, 0.1], [0.1, 0, 0.4, -0.3]);
    const vector = { re: [0.3, 0.5, -0.2, 0.1], im: [0.1, 0, 0.4, -0.3] };
    expect(fidelityToTarget(rho, { kind: "density", rho: target })).toBeCloseTo(fidelityToTarget(rho, { kind: "vector", vector }), 9);
  });

  it("rejects a target of the wrong size or with a negative eigenvalue", () => {
    const rho = fromPlain(werner(0.5));
    expect(() => fidelityToTarget(rho, { kind: "vector", vector: { re: [1, 0], im: [0, 0] } })).toThrow(/4 complex entries/);
    expect(() => fidelityToTarget(rho, { kind: "density", rho: { re: [[1.5, 0, 0, 0], [0, -0.5, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0]], im: werner(0).im } })).toThrow(/negative eigenvalue/);
  });
});

describe("phase-optimised fidelity: (ρ_aa + ρ_bb)/2 + |ρ_ab| at φ = −arg ρ_ab (from the definition)", () => {
  it("finds φ of (|HV⟩ + e^{iφ}|VH⟩)/√2 and fidelity 1, where the fixed ψ⁻ fidelity is (1 − cos φ)/2", () => {
    for (const phi of [0, 0.4, 1.7, Math.PI, -2.5]) {
      const rho = pure([0, S, S * Math.cos(phi), 0], [0, 0, S * Math.sin(phi), 0]);
      const best = phaseOptimisedFidelity(fromPlain(rho), "HV/VH");
      expect(best.fidelity).toBeCloseTo(1, 12);
      const wrapped = Math.atan2(Math.sin(phi), Math.cos(phi));
      expect(Math.abs(Math.atan2(Math.sin(best.phase - wrapped), Math.cos(best.phase - wrapped)))).toBeLessThan(1e-9);
      expect(figuresOfMerit(rho, "psi-").fidelity).toBeCloseTo((1 - Math.cos(phi)) / 2, 12);
    }
  });
});
