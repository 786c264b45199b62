/** Random and named states for the physics tests (Ginibre ensemble: ρ = G G† / Tr, G complex Gaussian). */
import fc from "fast-check";
import type { DensityMatrix } from "@shared/physics";

/** A density matrix of the given dimension and rank built from the numbers `g` (length ≥ 2·d·rank). */
export function ginibre(g: number[], d: number, rank = d): DensityMatrix {
  const re = Array.from({ length: d }, () => new Array(d).fill(0));
  const im = Array.from({ length: d }, () => new Array(d).fill(0));
  const at = (i: number, k: number) => [g[2 * (i * rank + k)], g[2 * (i * rank + k) + 1]];
  let trace = 0;
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      for (let k = 0; k < rank; k++) {
        const [ar, ai] = at(i, k);
        const [br, bi] = at(j, k);
        re[i][j] += ar * br + ai * bi;
        im[i][j] += ai * br - ar * bi;
      }
    }
    trace += re[i][i];
  }
  return { re: re.map((r) => r.map((x) => x / trace)), im: im.map((r) => r.map((x) => x / trace + 0)) };
}

/** fast-check arbitrary of d×d density matrices of rank minRank … maxRank. */
export function arbitraryState(d: number, maxRank = d, minRank = 1): fc.Arbitrary<DensityMatrix> {
  return fc
    .integer({ min: minRank, max: maxRank })
    .chain((rank) =>
      fc
        .array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 2 * d * rank, maxLength: 2 * d * rank })
        .filter((g) => g.some((x) => Math.abs(x) > 0.05))
        .map((g) => ginibre(g, d, rank)),
    );
}

/** p|ψ⁻⟩⟨ψ⁻| + (1 − p) I/4 (Werner, Phys. Rev. A 40, 4277 (1989)). */
export function werner(p: number): DensityMatrix {
  const psi = [[0, 0, 0, 0], [0, 0.5, -0.5, 0], [0, -0.5, 0.5, 0], [0, 0, 0, 0]];
  return {
    re: psi.map((r, i) => r.map((x, j) => p * x + (i === j ? (1 - p) / 4 : 0))),
    im: psi.map((r) => r.map(() => 0)),
  };
}

/** |v⟩⟨v| of a (not necessarily normalised) complex vector. */
export function pure(re: number[], im: number[] = re.map(() => 0)): DensityMatrix {
  const n = Math.sqrt(re.reduce((s, x, i) => s + x * x + im[i] * im[i], 0));
  const a = re.map((x) => x / n);
  const b = im.map((x) => x / n);
  return {
    re: a.map((_, i) => a.map((__, j) => a[i] * a[j] + b[i] * b[j])),
    im: a.map((_, i) => a.map((__, j) => b[i] * a[j] - a[i] * b[j] + 0)),
  };
}

export function maxAbsDiff(a: DensityMatrix, b: DensityMatrix): number {
  let m = 0;
  a.re.forEach((row, i) => row.forEach((x, j) => (m = Math.max(m, Math.abs(x - b.re[i][j]), Math.abs(a.im[i][j] - b.im[i][j])))));
  return m;
}

export function conjugateOf(a: DensityMatrix): DensityMatrix {
  return { re: a.re.map((r) => [...r]), im: a.im.map((r) => r.map((x) => -x + 0)) };
}
