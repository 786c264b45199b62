/**
 * NLL(θ) = Σ_k [μ_k − n_k ln μ_k] in the Cholesky parameters θ of σ = T T† (see
 * choleskyParametrisation.ts), with its gradient, exact Hessian and exact changes along a line, for
 * the damped Newton iteration in maximumLikelihood.ts. All buffers are allocated once.
 *
 * With v_k = T†ψ_k and μ_k = w_k ‖v_k‖²:
 *   ∂μ_k/∂Re T_ij = 2 w_k Re(ψ_k,i conj v_k,j),  ∂μ_k/∂Im T_ij = 2 w_k Im(ψ_k,i conj v_k,j),
 *   ∇NLL = Σ_k c_k ∇μ_k,  c_k = 1 − n_k/μ_k (1 for rows without counts),
 *   ∇²NLL = Σ_k (n_k/μ_k²) ∇μ_k ∇μ_kᵀ + ∇²_θ Tr(T† G T),  G = Σ_k c_k w_k |ψ_k⟩⟨ψ_k|,
 * where the last Hessian is block diagonal over the columns j of T: 2·[[Re G, −Im G], [Im G, Re G]]
 * on the entries i, l ≥ j.
 *
 * One instance serves every search on a measurement model: `reset` gives it the analysed states
 * in a new basis and the rank of the face. ∇μ_k is stored transposed so that the Gauss–Newton
 * part of the Hessian is a run of dot products (linalg/symmetricRankUpdate.ts).
 */
import type { PreparedCounts } from "./corrections";
import type { LinePoint, NewtonProblem } from "./linalg/dampedNewton";
import { type CMatrix, zeros } from "./linalg/complexMatrix";
import { unpackParameters } from "./choleskyParametrisation";
import { symmetricRankUpdate } from "./linalg/symmetricRankUpdate";
import { memoByKey } from "./memo";

/** The analysed states |ψ_k⟩ (index k·d + basis index) in the basis of the search. */
export interface AnalysedStates {
  dimension: number;
  rows: number;
  psiRe: Float64Array;
  psiIm: Float64Array;
}

export class PoissonNewton implements NewtonProblem {
  readonly size: number;
  readonly gradient: Float64Array;
  readonly hessian: Float64Array;
  /** Parameters of the columns j < rank of T are free; the others stay 0. */
  readonly free: Uint8Array;
  /** G at the last evaluated θ. */
  readonly g: CMatrix;
  /** Σ_k μ_k at the last evaluated θ. */
  totalExpected = 0;
  private model: AnalysedStates;
  private data: PreparedCounts;
  private readonly d: number;
  private readonly mu: Float64Array;
  private readonly coef: Float64Array;
  private readonly curvature: Float64Array;
  private readonly vRe: Float64Array;
  private readonly vIm: Float64Array;
  /** ∇μ_k transposed: dmu[p · rows + k] = ∂μ_k/∂θ_p */
  private readonly dmu: Float64Array;
  private readonly scaled: Float64Array;
  private readonly t: CMatrix;
  private readonly step: CMatrix;
  private readonly coupling: Couplings;
  private readonly lineLinear: Float64Array;
  private readonly lineQuadratic: Float64Array;
  /** Indices of the free parameters, ascending; frozen ones need only their diagonal (the shift uses the mean diagonal). */
  private active: Int32Array = new Int32Array(0);
  private frozen: Int32Array = new Int32Array(0);

  constructor(model: AnalysedStates, data: PreparedCounts, rank = model.dimension) {
    const d = model.dimension;
    this.d = d;
    this.size = d * d;
    this.model = model;
    this.data = data;
    this.free = new Uint8Array(this.size);
    this.gradient = new Float64Array(this.size);
    this.hessian = new Float64Array(this.size * this.size);
    this.mu = new Float64Array(model.rows);
    this.coef = new Float64Array(model.rows);
    this.curvature = new Float64Array(model.rows);
    this.vRe = new Float64Array(model.rows * d);
    this.vIm = new Float64Array(model.rows * d);
    this.dmu = new Float64Array(model.rows * this.size);
    this.scaled = new Float64Array(model.rows * this.size);
    this.t = zeros(d);
    this.step = zeros(d);
    this.g = zeros(d);
    this.coupling = couplings(d);
    this.lineLinear = new Float64Array(model.rows);
    this.lineQuadratic = new Float64Array(model.rows);
    this.reset(model, data, rank);
  }

  /** Same dimension and number of rows: new states (another basis), counts and rank of the face. */
  reset(model: AnalysedStates, data: PreparedCounts, rank: number): void {
    if (model.dimension !== this.d || model.rows !== this.model.rows) throw new Error("internal: PoissonNewton reused for another shape");
    this.model = model;
    this.data = data;
    const d = this.d;
    this.free.fill(0);
    for (let i = 0; i < d; i++) for (let j = 0; j <= i; j++) if (j < rank) this.free.fill(1, i * i + 2 * j, i * i + 2 * j + (j < i ? 2 : 1));
    const all = Array.from({ length: this.size }, (_, p) => p);
    this.active = Int32Array.from(all.filter((p) => this.free[p]));
    this.frozen = Int32Array.from(all.filter((p) => !this.free[p]));
  }

  /**
   * μ_k, v_k, c_k and G at θ: what the certificate needs. ∇μ_k and the gradient follow in
   * buildHessian, only when a step is taken.
   */
  evaluate(theta: Float64Array): void {
    const { d, model, data, mu, coef, curvature, vRe, vIm } = this;
    const { psiRe, psiIm } = model;
    const rows = model.rows;
    const tRe = this.t.re as Float64Array, tIm = this.t.im as Float64Array;
    unpackParameters(theta, d, tRe, tIm);
    let total = 0;
    for (let k = 0; k < rows; k++) {
      const o = k * d;
      let norm2 = 0;
      for (let j = 0; j < d; j++) {
        let ar = 0;
        let ai = 0;
        for (let i = j; i < d; i++) {
          const tr = tRe[i * d + j], ti = tIm[i * d + j];
          const pr = psiRe[o + i], pi = psiIm[o + i];
          ar += tr * pr + ti * pi;
          ai += tr * pi - ti * pr;
        }
        vRe[o + j] = ar;
        vIm[o + j] = ai;
        norm2 += ar * ar + ai * ai;
      }
      const w = data.weights[k];
      const m = w * norm2;
      mu[k] = m;
      total += m;
      const nk = data.counts[k];
      coef[k] = nk > 0 ? 1 - nk / m : 1;
      curvature[k] = nk === 0 ? 0 : nk / (m * m);
    }
    this.totalExpected = total;
    this.projectorSum();
  }

  /** ∇μ_k (stored transposed) and the gradient at the last evaluated θ. */
  private rowGradients(): void {
    const { d, model, data, coef, vRe, vIm, dmu, size, gradient } = this;
    const { psiRe, psiIm } = model;
    const rows = model.rows;
    for (let k = 0; k < rows; k++) {
      const o = k * d;
      const w = data.weights[k];
      for (let i = 0; i < d; i++) {
        const pr = 2 * w * psiRe[o + i], pi = 2 * w * psiIm[o + i];
        const base = i * i;
        for (let j = 0; j < i; j++) {
          const p = base + 2 * j;
          dmu[p * rows + k] = pr * vRe[o + j] + pi * vIm[o + j];
          dmu[(p + 1) * rows + k] = pi * vRe[o + j] - pr * vIm[o + j];
        }
        dmu[(base + 2 * i) * rows + k] = pr * vRe[o + i] + pi * vIm[o + i];
      }
    }
    for (let p = 0; p < size; p++) {
      let s = 0;
      const o = p * rows;
      for (let k = 0; k < rows; k++) s += coef[k] * dmu[o + k];
      gradient[p] = s;
    }
  }

  /** The gradient and the Hessian at the last evaluated θ. */
  buildHessian(): void {
    const { size, hessian: h, g, coupling, dmu, curvature } = this;
    const rows = this.model.rows;
    this.rowGradients();
    h.fill(0);
    symmetricRankUpdate(dmu, curvature, rows, size, h, this.scaled, this.active);
    for (const p of this.frozen) {
      let s = 0;
      const o = p * rows;
      for (let k = 0; k < rows; k++) s += curvature[k] * dmu[o + k] * dmu[o + k];
      h[p * size + p] = s;
    }
    const { target, source, sign } = coupling;
    for (let e = 0; e < target.length; e++) {
      const sg = sign[e];
      h[target[e]] += sg === 0 ? 2 * g.re[source[e]] : 2 * sg * g.im[source[e]];
    }
    for (let a = 0; a < size; a++) for (let b = 0; b < a; b++) h[b * size + a] = h[a * size + b];
  }

  /** Fixes the search direction δ: μ_k(θ + αδ) = μ_k + w_k (2α Re⟨v_k, u_k⟩ + α² ‖u_k‖²), u_k = Δ†ψ_k. */
  setDirection(delta: Float64Array): void {
    const { d, model, data, vRe, vIm, lineLinear, lineQuadratic } = this;
    const { psiRe, psiIm } = model;
    const sRe = this.step.re as Float64Array, sIm = this.step.im as Float64Array;
    unpackParameters(delta, d, sRe, sIm);
    for (let k = 0; k < model.rows; k++) {
      const o = k * d;
      let cross = 0;
      let norm2 = 0;
      for (let j = 0; j < d; j++) {
        let ar = 0;
        let ai = 0;
        for (let i = j; i < d; i++) {
          const tr = sRe[i * d + j], ti = sIm[i * d + j];
          const pr = psiRe[o + i], pi = psiIm[o + i];
          ar += tr * pr + ti * pi;
          ai += tr * pi - ti * pr;
        }
        cross += vRe[o + j] * ar + vIm[o + j] * ai;
        norm2 += ar * ar + ai * ai;
      }
      lineLinear[k] = 2 * data.weights[k] * cross;
      lineQuadratic[k] = data.weights[k] * norm2;
    }
  }

  /**
   * NLL(θ + αδ) − NLL(θ) and its first two derivatives in α, exact (log1p of the relative
   * change of each μ_k); value +∞ where some μ_k with counts would reach 0.
   */
  along(alpha: number): LinePoint {
    const { model, data, mu, lineLinear: b, lineQuadratic: c } = this;
    let value = 0;
    let slope = 0;
    let curvature = 0;
    for (let k = 0; k < model.rows; k++) {
      const dm = alpha * (b[k] + alpha * c[k]);
      const d1 = b[k] + 2 * alpha * c[k];
      const nk = data.counts[k];
      if (nk > 0) {
        const rel = dm / mu[k];
        if (!(rel > -1)) return { value: Infinity, slope: NaN, curvature: NaN };
        const m = mu[k] + dm;
        value += dm - nk * Math.log1p(rel);
        slope += d1 * (1 - nk / m);
        curvature += 2 * c[k] * (1 - nk / m) + (nk * d1 * d1) / (m * m);
      } else {
        value += dm;
        slope += d1;
        curvature += 2 * c[k];
      }
    }
    return { value, slope, curvature };
  }

  /** G = Σ_k c_k w_k |ψ_k⟩⟨ψ_k| into this.g. */
  private projectorSum(): void {
    const { d, model, data, coef, g } = this;
    const { psiRe, psiIm } = model;
    const gr = g.re as Float64Array, gi = g.im as Float64Array;
    gr.fill(0);
    gi.fill(0);
    for (let k = 0; k < model.rows; k++) {
      const c = coef[k] * data.weights[k];
      const o = k * d;
      for (let i = 0; i < d; i++) {
        const xr = c * psiRe[o + i], xi = c * psiIm[o + i];
        for (let j = 0; j <= i; j++) {
          gr[i * d + j] += xr * psiRe[o + j] + xi * psiIm[o + j];
          gi[i * d + j] += xi * psiRe[o + j] - xr * psiIm[o + j];
        }
      }
    }
    for (let i = 0; i < d; i++) {
      for (let j = 0; j < i; j++) {
        gr[j * d + i] = gr[i * d + j];
        gi[j * d + i] = -gi[i * d + j];
      }
    }
  }
}

/** Lower-triangle Hessian entries fed by G: value 2·Re G (sign 0) or 2·sign·Im G (sign ±1). */
interface Couplings {
  target: Int32Array;
  source: Int32Array;
  sign: Int8Array;
}

/** The coupling tables of dimension d, built once (they are only read). */
const couplings = memoByKey(buildCouplings);

function buildCouplings(d: number): Couplings {
  const size = d * d;
  let count = 0;
  for (let j = 0; j < d; j++) for (let i = j; i < d; i++) count += 4 * (i - j + 1);
  const target = new Int32Array(count);
  const source = new Int32Array(count);
  const sign = new Int8Array(count);
  let e = 0;
  for (let j = 0; j < d; j++) {
    for (let i = j; i < d; i++) {
      for (let l = j; l <= i; l++) {
        const src = i * d + l;
        const ar = i * i + 2 * j; // Re T_ij; Im T_ij follows when j < i
        const br = l * l + 2 * j;
        const put = (a: number, b: number, sg: number) => {
          target[e] = a >= b ? a * size + b : b * size + a;
          source[e] = src;
          sign[e++] = sg;
        };
        put(ar, br, 0);
        if (j < i && j < l) put(ar + 1, br + 1, 0);
        if (j < i) put(ar + 1, br, 1);
        if (j < l) put(ar, br + 1, -1);
      }
    }
  }
  return { target: target.subarray(0, e), source: source.subarray(0, e), sign: sign.subarray(0, e) };
}
