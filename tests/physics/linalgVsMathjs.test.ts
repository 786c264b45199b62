/**
 * Our typed-array kernels against a general-purpose reference library (mathjs 15: `eigs`,
 * `sqrtm` on complex matrices) on random states of one to three qubits.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import * as math from "mathjs";
import { fromPlain, multiply } from "@shared/physics/linalg/complexMatrix";
import { hermitianEigen, hermitianFunction } from "@shared/physics/linalg/hermitianEigen";
import { pivotedCholesky } from "@shared/physics/linalg/pivotedCholesky";
import { uhlmannFidelity } from "@shared/physics/fidelity";
import type { DensityMatrix } from "@shared/physics";
import { arbitraryState } from "./support/states";

/** Full-rank states with λ_min ≥ 1e-3, where mathjs' Denman–Beavers sqrtm (which inverts) is accurate. */
const wellConditioned = arbitraryState(4, 4, 4).filter((rho) => hermitianEigen(fromPlain(rho)).values[3] > 1e-3);

const toMathjs = (m: DensityMatrix) => math.matrix(m.re.map((row, i) => row.map((x, j) => math.complex(x, m.im[i][j]))));
const realParts = (values: unknown) => (math.flatten(values as math.Matrix).toArray() as (number | math.Complex)[]).map((v) => (typeof v === "number" ? v : v.re));

describe("Hermitian eigen-decomposition (complex Jacobi) against mathjs eigs", () => {
  for (const d of [2, 4, 8]) {
    it(`eigenvalues of random ${d}×${d} density matrices agree to 1e-12`, () => {
      fc.assert(
        fc.property(arbitraryState(d), (rho) => {
          const ours = Array.from(hermitianEigen(fromPlain(rho)).values).sort((a, b) => a - b);
          const ref = realParts(math.eigs(toMathjs(rho)).values).sort((a, b) => a - b);
          ours.forEach((v, i) => expect(v).toBeCloseTo(ref[i], 12));
        }),
        { numRuns: 25, seed: 20261202 },
      );
    });
  }

  it("eigenvectors satisfy A v = λ v and are orthonormal", () => {
    fc.assert(
      fc.property(arbitraryState(4), (rho) => {
        const a = fromPlain(rho);
        const { values, vectors } = hermitianEigen(a);
        const av = multiply(a, vectors);
        for (let i = 0; i < 4; i++) {
          for (let k = 0; k < 4; k++) {
            expect(av.re[i * 4 + k]).toBeCloseTo(values[k] * vectors.re[i * 4 + k], 12);
            expect(av.im[i * 4 + k]).toBeCloseTo(values[k] * vectors.im[i * 4 + k], 12);
          }
        }
        for (let k = 0; k < 4; k++) {
          for (let l = 0; l < 4; l++) {
            let re = 0;
            let im = 0;
            for (let i = 0; i < 4; i++) {
              re += vectors.re[i * 4 + k] * vectors.re[i * 4 + l] + vectors.im[i * 4 + k] * vectors.im[i * 4 + l];
              im += vectors.re[i * 4 + k] * vectors.im[i * 4 + l] - vectors.im[i * 4 + k] * vectors.re[i * 4 + l];
            }
            expect(re).toBeCloseTo(k === l ? 1 : 0, 12);
            expect(im).toBeCloseTo(0, 12);
          }
        }
      }),
      { numRuns: 25, seed: 7 },
    );
  });
});

describe("matrix square root against mathjs sqrtm", () => {
  it("√ρ of random full-rank two-qubit states agrees entry by entry to 1e-9", () => {
    fc.assert(
      fc.property(wellConditioned, (rho) => {
        const ours = hermitianFunction(fromPlain(rho), (l) => Math.sqrt(Math.max(0, l)));
        const ref = math.sqrtm(toMathjs(rho)) as math.Matrix;
        for (let i = 0; i < 4; i++) {
          for (let j = 0; j < 4; j++) {
            const r = math.complex(ref.get([i, j]) as math.Complex);
            expect(ours.re[i * 4 + j]).toBeCloseTo(r.re, 9);
            expect(ours.im[i * 4 + j]).toBeCloseTo(r.im, 9);
          }
        }
      }),
      { numRuns: 20, seed: 11 },
    );
  });
});

describe("Uhlmann fidelity (Tr √(√σ ρ √σ))² against the same formula in mathjs", () => {
  it("agrees on random pairs of two-qubit states to 1e-9", () => {
    fc.assert(
      fc.property(wellConditioned, wellConditioned, (rho, sigma) => {
        const rootSigma = math.sqrtm(toMathjs(sigma));
        const inner = math.multiply(math.multiply(rootSigma, toMathjs(rho)), rootSigma) as math.Matrix;
        const ref = realParts(math.eigs(inner).values).reduce((s, l) => s + Math.sqrt(Math.max(0, l)), 0) ** 2;
        expect(uhlmannFidelity(fromPlain(rho), fromPlain(sigma))).toBeCloseTo(ref, 9);
      }),
      { numRuns: 15, seed: 3 },
    );
  });

  it("is 1 for a state with itself and symmetric in its arguments", () => {
    fc.assert(
      fc.property(arbitraryState(4), arbitraryState(4), (rho, sigma) => {
        expect(uhlmannFidelity(fromPlain(rho), fromPlain(rho))).toBeCloseTo(1, 7);
        expect(uhlmannFidelity(fromPlain(rho), fromPlain(sigma))).toBeCloseTo(uhlmannFidelity(fromPlain(sigma), fromPlain(rho)), 7);
      }),
      { numRuns: 15, seed: 5 },
    );
  });
});

describe("pivoted Cholesky rank", () => {
  it("finds the rank of a Gram matrix B Bᵀ (B 6×3) and solves full-rank systems", () => {
    const b = [[1, 2, 0], [0, 1, 1], [3, 0, 1], [1, 1, 1], [2, -1, 0], [0, 0, 5]];
    const gram = new Float64Array(36);
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) gram[i * 6 + j] = b[i].reduce((s, x, k) => s + x * b[j][k], 0);
    expect(pivotedCholesky(gram, 6).rank).toBe(3);
    const full = Float64Array.from([4, 1, 0, 1, 3, 1, 0, 1, 2]);
    expect(pivotedCholesky(full, 3).rank).toBe(3);
  });
});
