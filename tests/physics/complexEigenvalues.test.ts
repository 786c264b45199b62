import { describe, expect, it } from "vitest";
import * as math from "mathjs";
import { complexEigenvalues } from "../../shared/physics/linalg/complexEigenvalues";
import { fromPlain, type CMatrix } from "../../shared/physics/linalg/complexMatrix";
import { concurrence } from "../../shared/physics/entanglement";
import { randomStream } from "../../shared/physics/random";

const mulberry = (seed: number) => {
  const stream = randomStream(seed);
  return () => stream.uniform();
};

/** A random complex n×n matrix with entries in [−1, 1] + i[−1, 1]. */
function randomMatrix(n: number, next: () => number): CMatrix {
  const m = { n, re: new Float64Array(n * n), im: new Float64Array(n * n) };
  for (let k = 0; k < n * n; k++) {
    m.re[k] = 2 * next() - 1;
    m.im[k] = 2 * next() - 1;
  }
  return m;
}

const toMath = (m: CMatrix) => Array.from({ length: m.n }, (_, i) => Array.from({ length: m.n }, (_, j) => math.complex(m.re[i * m.n + j], m.im[i * m.n + j])));
const byValue = (a: { re: number; im: number }, b: { re: number; im: number }) => a.re - b.re || a.im - b.im;

describe("eigenvalues of general complex matrices (Hessenberg QR, Golub & Van Loan §7.5)", () => {
  it("agree with mathjs's eigs on random non-Hermitian matrices (independent implementation)", () => {
    const next = mulberry(20261202);
    for (let trial = 0; trial < 40; trial++) {
      const n = 2 + (trial % 5);
      const a = randomMatrix(n, next);
      const ours = complexEigenvalues(a).sort(byValue);
      const values = (math.eigs(toMath(a) as never, { eigenvectors: false }).values as unknown as math.MathArray).valueOf() as Array<number | math.Complex>;
      const theirs = values.map((v) => (typeof v === "number" ? { re: v, im: 0 } : { re: v.re, im: v.im })).sort(byValue);
      expect(ours).toHaveLength(n);
      for (let k = 0; k < n; k++) {
        expect(ours[k].re).toBeCloseTo(theirs[k].re, 9);
        expect(ours[k].im).toBeCloseTo(theirs[k].im, 9);
      }
    }
  });

  it("preserve the trace (sum of eigenvalues) to rounding", () => {
    const next = mulberry(7);
    const a = randomMatrix(6, next);
    const ev = complexEigenvalues(a);
    let tr = 0;
    let ti = 0;
    for (let k = 0; k < 6; k++) {
      tr += a.re[k * 6 + k];
      ti += a.im[k * 6 + k];
    }
    expect(ev.reduce((s, v) => s + v.re, 0)).toBeCloseTo(tr, 12);
    expect(ev.reduce((s, v) => s + v.im, 0)).toBeCloseTo(ti, 12);
  });

  it("handle exactly degenerate spectra (the identity, a Jordan-free triple eigenvalue)", () => {
    const id = fromPlain({ re: [[1, 0, 0], [0, 1, 0], [0, 0, 1]], im: [[0, 0, 0], [0, 0, 0], [0, 0, 0]] });
    expect(complexEigenvalues(id).map((v) => v.re)).toEqual([1, 1, 1]);
  });

  it("converge beside near-zero eigenvalues: ρρ̃ of a Monte Carlo linear estimate that once never deflated", () => {
    // Regression: this matrix (from a seeded Monte Carlo run of a ψ⁻-like source) made the purely
    // local deflation test wait forever; mathjs's eigs is the independent reference.
    const z = { n: 4, re: Float64Array.from([0.00030213954037619105, 0.00043213378714909224, -0.000667856852992814, 1.8565744225257168e-06, 0.007418482749407293, 0.47595068436811094, -0.46992694387073647, 0.000667856852992814, -0.007621077101255882, -0.48172596941225215, 0.47595068436811094, -0.0004321337871490923, -0.00011951883502299047, 0.007621077101255882, -0.007418482749407293, 0.00030213954037619105]), im: Float64Array.from([-9.269257233413308e-05, 0.004006094009982345, -0.003974732754837408, 0.00012043474507146711, -0.001845615682544883, 9.269257233413308e-05, -0.005024865707722289, 0.003974732754837408, 0.0016744494225204173, 0.005585892793011748, 9.269257233413308e-05, -0.004006094009982345, -0.0003407482432084103, -0.0016744494225204175, 0.001845615682544883, -9.269257233413308e-05]) };
    const ours = complexEigenvalues(z);
    const theirs = ((math.eigs(toMath(z) as never, { eigenvectors: false }).values as unknown as math.MathArray).valueOf() as math.Complex[]).map((v) =>
      typeof v === "number" ? { re: v, im: 0 } : { re: v.re, im: v.im },
    );
    expect(ours).toHaveLength(4);
    // A conjugate pair has equal real parts, so match each eigenvalue to its nearest reference.
    for (const t of theirs) {
      const nearest = Math.min(...ours.map((o) => Math.hypot(o.re - t.re, o.im - t.im)));
      expect(nearest).toBeLessThan(1e-10);
    }
  });

  it("refuse a matrix with NaN instead of looping (ml-matrix's EVD never returns on one)", () => {
    const bad = fromPlain({ re: [[1, Number.NaN], [0, 1]], im: [[0, 0], [0, 0]] });
    expect(() => complexEigenvalues(bad)).toThrow(/non-finite/);
  });

  it("give Wootters concurrence of a non-physical (indefinite) estimate: a Werner state pushed past p = 1", () => {
    // Werner (PRA 40, 4277 (1989)): ρ̃ = ρ, so the eigenvalues of ρρ̃ are the squares of ρ's,
    // (1+3p)²/16 and three times (1−p)²/16; Wootters' λ are their roots, and for p > 1
    // C = (1+3p)/4 − 3(p−1)/4 = 1 exactly (follows from Wootters' definition, PRL 80, 2245).
    const p = 1.02;
    const q = (1 - p) / 4;
    const rho = fromPlain({
      re: [
        [q, 0, 0, 0],
        [0, q + p / 2, -p / 2, 0],
        [0, -p / 2, q + p / 2, 0],
        [0, 0, 0, q],
      ],
      im: [[0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0]],
    });
    expect(concurrence(rho, false)).toBeCloseTo(1, 12);
  });
});
