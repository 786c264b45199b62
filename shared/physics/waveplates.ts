/**
 * The analyser of one arm: quarter-wave plate at q, then half-wave plate at h, then a PBS
 * whose transmitted port passes H (physics contract §2).
 *
 * Jones matrix of a retarder with fast axis at θ and retardance δ:
 *   W(θ, δ) = R(−θ) · diag(1, e^{iδ}) · R(θ),  R(θ) = [[cos θ, sin θ], [−sin θ, cos θ]]
 * (Hecht, "Optics", 5th ed., §8.12; global phase irrelevant). The analysed state is
 * |a⟩ = (W(h, π) · W(q, π/2))† |H⟩ for the transmitted port and (…)† |V⟩ for the reflected one.
 */
import type { ArmAngles, ArmCalibration } from "./types";
import type { CVector } from "./linalg/complexMatrix";

const DEG = Math.PI / 180;

/** A 2×2 complex matrix as [re00, im00, re01, im01, re10, im10, re11, im11]. */
type Jones = Float64Array;

export function retarder(thetaRad: number, deltaRad: number): Jones {
  const c = Math.cos(thetaRad);
  const s = Math.sin(thetaRad);
  const er = Math.cos(deltaRad);
  const ei = Math.sin(deltaRad);
  const cs = c * s;
  return Float64Array.of(
    c * c + s * s * er, s * s * ei,
    cs * (1 - er), -cs * ei,
    cs * (1 - er), -cs * ei,
    s * s + c * c * er, c * c * ei,
  );
}

function multiply2(a: Jones, b: Jones): Jones {
  const out = new Float64Array(8);
  for (let i = 0; i < 2; i++) {
    for (let j = 0; j < 2; j++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < 2; k++) {
        const ar = a[(i * 2 + k) * 2], ai = a[(i * 2 + k) * 2 + 1];
        const br = b[(k * 2 + j) * 2], bi = b[(k * 2 + j) * 2 + 1];
        re += ar * br - ai * bi;
        im += ar * bi + ai * br;
      }
      out[(i * 2 + j) * 2] = re;
      out[(i * 2 + j) * 2 + 1] = im;
    }
  }
  return out;
}

/** Total Jones matrix of the arm, HWP · QWP, with the plates' calibrations applied. */
export function armJones(qwpDeg: number, hwpDeg: number, calibration: ArmCalibration = {}): Jones {
  const q = (qwpDeg + (calibration.qwp?.fastAxisOffsetDeg ?? 0)) * DEG;
  const h = (hwpDeg + (calibration.hwp?.fastAxisOffsetDeg ?? 0)) * DEG;
  const dq = (90 + (calibration.qwp?.retardanceErrorDeg ?? 0)) * DEG;
  const dh = (180 + (calibration.hwp?.retardanceErrorDeg ?? 0)) * DEG;
  return multiply2(retarder(h, dh), retarder(q, dq));
}

/** The single-photon state this arm analyses: J†|H⟩ (transmitted) or J†|V⟩ (reflected). */
export function analyserState(angles: ArmAngles, calibration: ArmCalibration = {}): CVector {
  const j = armJones(angles.qwpDeg, angles.hwpDeg, calibration);
  const row = angles.port === "reflected" ? 1 : 0;
  // (J†)_{i,row} = conj(J_{row,i})
  return {
    re: Float64Array.of(j[(row * 2) * 2], j[(row * 2 + 1) * 2]),
    im: Float64Array.of(-j[(row * 2) * 2 + 1], -j[(row * 2 + 1) * 2 + 1]),
  };
}

/** |⟨a|b⟩|² of two single-photon states. */
export function overlap2(a: CVector, b: CVector): number {
  const re = a.re[0] * b.re[0] + a.im[0] * b.im[0] + a.re[1] * b.re[1] + a.im[1] * b.im[1];
  const im = a.re[0] * b.im[0] - a.im[0] * b.re[0] + a.re[1] * b.im[1] - a.im[1] * b.re[1];
  return re * re + im * im;
}
