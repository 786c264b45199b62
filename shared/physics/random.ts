/**
 * Seeded random numbers for simulation and Monte Carlo.
 *
 * Uniforms: pure-rand's xoroshiro128+ (Blackman & Vigna 2018) with 53-bit doubles. Stream i of
 * a seed is the generator jumped i times (each jump is 2⁶⁴ steps), so sample i draws the same
 * numbers whichever thread computes it.
 *
 * Poisson variates (our own: the npm samplers either lack a pluggable seeded generator or pull
 * in dozens of micro-packages): Knuth's multiplication method for λ < 10 (Knuth, TAOCP vol. 2,
 * 3rd ed., §3.4.1 F) and the transformed rejection method PTRS for λ ≥ 10 (Hörmann, Insurance:
 * Mathematics and Economics 12, 39 (1993), Algorithm PTRS).
 */
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";

export interface RandomStream {
  /** Uniform on [0, 1). */
  uniform(): number;
}

/** The stream for one sample index of a seed; advancing by jumps keeps streams disjoint. */
export function randomStream(seed: number, index = 0): RandomStream {
  const rng = xoroshiro128plus(seed | 0);
  for (let i = 0; i < index; i++) rng.jump();
  return { uniform: () => uniformFloat64(rng) };
}

/** Streams index … index+count−1 of a seed, jumping once per stream. */
export function* randomStreams(seed: number, from: number, count: number): Generator<RandomStream> {
  const rng = xoroshiro128plus(seed | 0);
  for (let i = 0; i < from; i++) rng.jump();
  for (let i = 0; i < count; i++) {
    const own = rng.clone();
    yield { uniform: () => uniformFloat64(own) };
    rng.jump();
  }
}

export function poisson(lambda: number, rng: RandomStream): number {
  if (!(lambda > 0)) return 0;
  if (lambda < 10) {
    const limit = Math.exp(-lambda);
    let k = 0;
    let p = rng.uniform();
    while (p > limit) {
      k++;
      p *= rng.uniform();
    }
    return k;
  }
  const slam = Math.sqrt(lambda);
  const logLam = Math.log(lambda);
  const b = 0.931 + 2.53 * slam;
  const a = -0.059 + 0.02483 * b;
  const invAlpha = 1.1239 + 1.1328 / (b - 3.4);
  const vr = 0.9277 - 3.6224 / (b - 2);
  for (;;) {
    const u = rng.uniform() - 0.5;
    const v = rng.uniform();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + lambda + 0.43);
    if (us >= 0.07 && v <= vr) return k;
    if (k < 0 || (us < 0.013 && v > us)) continue;
    if (Math.log(v) + Math.log(invAlpha) - Math.log(a / (us * us) + b) <= -lambda + k * logLam - logFactorial(k)) return k;
  }
}

const SMALL_LOG_FACTORIALS = (() => {
  const t = new Float64Array(16);
  for (let i = 1; i < 16; i++) t[i] = t[i - 1] + Math.log(i);
  return t;
})();

/** ln k! — exact table below 16, Stirling series above (error < 1e-12 there). */
export function logFactorial(k: number): number {
  if (k < 16) return SMALL_LOG_FACTORIALS[k];
  const x = k + 1;
  return (x - 0.5) * Math.log(x) - x + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * x) - 1 / (360 * x ** 3) + 1 / (1260 * x ** 5);
}

/** A fresh 31-bit seed when the caller gives none (the seed is then stored with the result). */
export function newSeed(): number {
  return Math.floor(Math.random() * 0x7fffffff);
}
