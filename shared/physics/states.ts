/**
 * Polarisation states and the Bell states, in the conventions of the physics contract:
 * |H⟩ = (1, 0), |V⟩ = (0, 1), |D⟩ = (H + V)/√2, |A⟩ = (H − V)/√2,
 * |R⟩ = (H + iV)/√2 and |L⟩ = (H − iV)/√2 by default; the "R=H-iV" setting swaps R and L.
 */
import type { BellName, Handedness, Letter, StateVector } from "./types";
import { type CVector, kronVectors } from "./linalg/complexMatrix";

export const LETTERS: readonly Letter[] = ["H", "V", "D", "A", "R", "L"];
export const DEFAULT_HANDEDNESS: Handedness = "R=H+iV";

const S = Math.SQRT1_2;

export function isLetter(c: string): c is Letter {
  return (LETTERS as readonly string[]).includes(c);
}

/** The single-photon state a letter stands for, under the setup's handedness. */
export function letterState(letter: Letter, handedness: Handedness = DEFAULT_HANDEDNESS): CVector {
  const sign = handedness === "R=H+iV" ? 1 : -1;
  switch (letter) {
    case "H":
      return vec([1, 0], [0, 0]);
    case "V":
      return vec([0, 1], [0, 0]);
    case "D":
      return vec([S, S], [0, 0]);
    case "A":
      return vec([S, -S], [0, 0]);
    case "R":
      return vec([S, 0], [0, sign * S]);
    case "L":
      return vec([S, 0], [0, -sign * S]);
  }
}

/** The orthogonal partner measured at the other PBS port. */
export const ORTHOGONAL: Record<Letter, Letter> = { H: "V", V: "H", D: "A", A: "D", R: "L", L: "R" };

/** Parses "HV" into ["H", "V"]; throws with the offending character named. */
export function parseLabel(label: string): Letter[] {
  const letters = label.trim().toUpperCase().split("");
  if (letters.length === 0) throw new Error("empty setting label");
  letters.forEach((c, i) => {
    if (!isLetter(c)) {
      throw new Error(`"${label}": letter ${i + 1} ("${c}") is not one of H, V, D, A, R, L`);
    }
  });
  return letters as Letter[];
}

/** Product state of a label, photon A first. */
export function labelState(label: string, handedness: Handedness = DEFAULT_HANDEDNESS): CVector {
  return kronVectors(parseLabel(label).map((l) => letterState(l, handedness)));
}

/**
 * Bell states (standard definitions, e.g. Nielsen & Chuang, "Quantum Computation and
 * Quantum Information", §1.3.6): φ± = (HH ± VV)/√2, ψ± = (HV ± VH)/√2.
 */
export const BELL_STATES: Record<BellName, StateVector> = {
  "phi+": { re: [S, 0, 0, S], im: [0, 0, 0, 0] },
  "phi-": { re: [S, 0, 0, -S], im: [0, 0, 0, 0] },
  "psi+": { re: [0, S, S, 0], im: [0, 0, 0, 0] },
  "psi-": { re: [0, S, -S, 0], im: [0, 0, 0, 0] },
};

export const BELL_NAMES: readonly BellName[] = ["phi+", "phi-", "psi+", "psi-"];

export function toCVector(v: StateVector): CVector {
  return { re: Float64Array.from(v.re), im: Float64Array.from(v.im) };
}

export function fromCVector(v: CVector): StateVector {
  return { re: Array.from(v.re), im: Array.from(v.im, (x) => x + 0) };
}

/** Scales a vector to unit norm; throws on the zero vector. */
export function normalised(v: CVector): CVector {
  let s = 0;
  for (let i = 0; i < v.re.length; i++) s += v.re[i] ** 2 + v.im[i] ** 2;
  if (!(s > 0)) throw new Error("the state vector is zero");
  const f = 1 / Math.sqrt(s);
  return { re: v.re.map((x) => x * f), im: v.im.map((x) => x * f) };
}

function vec(re: [number, number], im: [number, number]): CVector {
  const r = new Float64Array(2);
  const i = new Float64Array(2);
  r[0] = re[0];
  r[1] = re[1];
  i[0] = im[0];
  i[1] = im[1];
  return { re: r, im: i };
}
