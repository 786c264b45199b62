/**
 * Plain, JSON-serialisable data exchanged with the numeric core (stored as jsonb, sent to the
 * browser). Conventions follow the physics contract: photon A is the first tensor factor,
 * basis order HH, HV, VH, VV (generally: binary order with H = 0, V = 1, photon A most
 * significant).
 */

/** A complex matrix as two real matrices of the same shape. */
export interface DensityMatrix {
  re: number[][];
  im: number[][];
}

/** A complex column vector as two real arrays. */
export interface StateVector {
  re: number[];
  im: number[];
}

export type Letter = "H" | "V" | "D" | "A" | "R" | "L";

/** Circular-polarisation convention of the setup; stored with every run. */
export type Handedness = "R=H+iV" | "R=H-iV";

export type Port = "transmitted" | "reflected";

/** Deviations of one waveplate from its nominal behaviour. */
export interface PlateCalibration {
  /** Angle of the true fast axis minus the angle read on the mount, degrees. */
  fastAxisOffsetDeg?: number;
  /** Retardance minus nominal (90° for a QWP, 180° for an HWP), degrees of phase. */
  retardanceErrorDeg?: number;
}

export interface ArmCalibration {
  qwp?: PlateCalibration;
  hwp?: PlateCalibration;
}

/** Waveplate angles turned in one arm and the PBS port that was counted. */
export interface ArmAngles {
  qwpDeg: number;
  hwpDeg: number;
  port?: Port;
}

/**
 * One measured row. `setting` is either a label such as "HV" (one letter per photon,
 * photon A first) or the waveplate angles of every arm.
 */
export interface CountsRow {
  setting: string | ArmAngles[];
  counts: number;
  /** Exposure in seconds (default 1). */
  seconds?: number;
  singlesA?: number;
  singlesB?: number;
  /** Relative efficiency of the detector pair that recorded this row (default 1). */
  efficiency?: number;
  /** Drift monitor reading for this row (any unit, e.g. a power meter or summed singles). */
  monitor?: number;
}

export interface SetupConventions {
  handedness?: Handedness;
  /** One entry per photon, photon A first; missing entries mean ideal plates. */
  calibration?: ArmCalibration[];
  /**
   * Per photon: true when both PBS ports are counted, so that V, A, L rows were taken at the
   * reflected port of the H, D, R settings (matters only with calibrated plates).
   */
  bothPorts?: boolean[];
}

export type BellName = "phi+" | "phi-" | "psi+" | "psi-";

export type Target =
  | BellName
  | { kind: "vector"; vector: StateVector }
  | { kind: "density"; rho: DensityMatrix };

export type Method = "linear" | "mle" | "projected";
