/**
 * Linear inversion: ordinary least squares for σ from the rates r_k = n_k / w_k,
 * min_x Σ_k (Σ_j A_kj x_j − r_k)², x_j = Tr(σ Γ_j) (physics contract §4). For the 16 settings
 * of James et al., Phys. Rev. A 64, 052312 (2001) the system is square and this is their exact
 * inversion (their Eq. (3.13)); for overcomplete sets it is the least-squares solution.
 * Solved through the normal equations AᵀA x = Aᵀ r with a rank-revealing pivoted Cholesky:
 * tomography design matrices are well conditioned (pivot ratios ≥ 1e-3), so squaring the
 * condition number costs no visible accuracy, and the same factorisation tells whether the
 * set is informationally complete.
 */
import type { MeasurementModel } from "./measurementModel";
import { designRow, fromPauliCoefficients, pauliName } from "./pauliBasis";
import { choleskySolve, pivotedCholesky, type PivotedCholesky } from "./linalg/pivotedCholesky";
import type { CMatrix } from "./linalg/complexMatrix";
import { EngineInputError } from "./errors";

export interface LinearSystem {
  photons: number;
  /** d² unknowns */
  params: number;
  rows: number;
  /** Row-major rows × params */
  design: Float64Array;
  /**
   * Column indices of the non-zero design entries of row k: nonzero[nonzeroStart[k] … nonzeroStart[k+1]).
   * Ideal letter states have two non-zero Bloch components, so a row has only 2ⁿ of its 4ⁿ entries.
   */
  nonzero: Int32Array;
  nonzeroStart: Int32Array;
  normal: PivotedCholesky;
}

/** Relative pivot below which the set counts as informationally incomplete. */
export const RANK_TOLERANCE = 1e-10;

export function prepareLinearSystem(model: MeasurementModel): LinearSystem {
  const { photons, rows } = model;
  const p = model.dimension * model.dimension;
  const design = new Float64Array(rows * p);
  for (let k = 0; k < rows; k++) designRow(model.singleRe, model.singleIm, k * photons * 2, photons, design, k * p);
  const { nonzero, nonzeroStart } = sparsity(design, rows, p);
  const gram = new Float64Array(p * p);
  for (let k = 0; k < rows; k++) {
    const o = k * p;
    for (let a = nonzeroStart[k]; a < nonzeroStart[k + 1]; a++) {
      const i = nonzero[a];
      const ai = design[o + i];
      for (let b = nonzeroStart[k]; b <= a; b++) gram[i * p + nonzero[b]] += ai * design[o + nonzero[b]];
    }
  }
  const normal = pivotedCholesky(gram, p, RANK_TOLERANCE);
  if (normal.rank < p) throw incompleteError(gram, p, normal.rank, photons, rows);
  return { photons, params: p, rows, design, nonzero, nonzeroStart, normal };
}

/** σ (unnormalised, Tr σ = estimated pair rate) from the rates; may be non-physical. */
export function linearInversionSigma(system: LinearSystem, rates: Float64Array): CMatrix {
  const { params: p, rows, design, nonzero, nonzeroStart } = system;
  const rhs = new Float64Array(p);
  for (let k = 0; k < rows; k++) {
    const r = rates[k];
    if (r === 0) continue;
    for (let e = nonzeroStart[k]; e < nonzeroStart[k + 1]; e++) rhs[nonzero[e]] += design[k * p + nonzero[e]] * r;
  }
  return fromPauliCoefficients(choleskySolve(system.normal, rhs), system.photons);
}

function sparsity(design: Float64Array, rows: number, p: number): { nonzero: Int32Array; nonzeroStart: Int32Array } {
  const nonzeroStart = new Int32Array(rows + 1);
  const list: number[] = [];
  for (let k = 0; k < rows; k++) {
    for (let j = 0; j < p; j++) if (design[k * p + j] !== 0) list.push(j);
    nonzeroStart[k + 1] = list.length;
  }
  return { nonzero: Int32Array.from(list), nonzeroStart };
}

function incompleteError(gram: Float64Array, p: number, rank: number, photons: number, rows: number): EngineInputError {
  const blind: string[] = [];
  for (let j = 0; j < p; j++) if (gram[j * p + j] === 0) blind.push(pauliName(j, photons));
  const which = blind.length
    ? ` No row is sensitive to the Pauli component${blind.length > 1 ? "s" : ""} ${blind.slice(0, 6).join(", ")}${blind.length > 6 ? ", …" : ""}.`
    : "";
  return new EngineInputError(
    "informationally_incomplete",
    `The ${rows} settings are not informationally complete for ${photons} photon(s): they determine only ${rank} of the ${p} real parameters of the density matrix.${which} Add settings (for example a standard 16- or 36-setting set) before reconstructing.`,
  );
}
