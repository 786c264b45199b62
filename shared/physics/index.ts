/**
 * The public API of Rhomb's numeric core. Pure functions over plain JSON-serialisable data;
 * conventions in the physics contract (photon A first, basis HH, HV, VH, VV, R = H + iV by
 * default). See DEVELOPERS.md, "Numeric core (shared/physics)".
 */
export { ENGINE_VERSION } from "./version";
export type {
  ArmAngles, ArmCalibration, BellName, CountsRow, DensityMatrix, Handedness, Letter, Method, PlateCalibration, Port,
  SetupConventions, StateVector, Target,
} from "./types";
export { EngineInputError, type EngineErrorCode } from "./errors";

// States and the measurement model
export { BELL_NAMES, BELL_STATES, DEFAULT_HANDEDNESS, LETTERS, ORTHOGONAL, labelState, letterState, parseLabel } from "./states";
export { analyserState, armJones } from "./waveplates";
export { anglesForLetter, anglesForState, type AnalyserAngles } from "./analyserAngles";
export {
  MAX_PHOTONS, STANDARD_SET_IDS, settingSheet, standardSet,
  type MeasurementSet, type SettingGroup, type SettingSheet, type SheetSetting, type StandardSetId,
} from "./settings";
export { prepareCounts, type CorrectionOptions, type PreparedCounts } from "./corrections";

// Reconstruction
export {
  basisLabels, describe, prepareProblem, reconstruct, solveProblem,
  type PreparedProblem, type Reconstruction, type ReconstructInput, type ReconstructOptions,
} from "./reconstruct";
export { MLE_TOLERANCE } from "./maximumLikelihood";
export { RANK_TOLERANCE } from "./linearInversion";
export { PHYSICAL_TOLERANCE } from "./tolerances";

// Figures of merit
export { figuresOfMerit, chshFromRho, type FiguresOfMerit } from "./figuresOfMerit";
export { fidelityToTarget, phaseOptimisedFidelity, pureStateFidelity, uhlmannFidelity, type PhaseOptimisedFidelity } from "./fidelity";
export { chshMaximum, concurrence, negativity, partialTranspose } from "./entanglement";
export { STANDARD_BELL_ANGLES, type BellAngles } from "./bell/angles";

// Uncertainty and simulation
export {
  DEFAULT_SAMPLES, MAX_SAMPLES, METRIC_NAMES, monteCarlo, monteCarloBlock, resolveSamples, summariseMonteCarlo,
  type MetricName, type MonteCarloOptions, type MonteCarloResult, type SampleBlock,
} from "./monteCarlo";
export { simulateCounts, type SimulationOptions } from "./simulateCounts";
export { poisson, randomStream } from "./random";
