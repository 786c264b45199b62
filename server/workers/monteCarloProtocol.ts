/** Messages between the Monte Carlo pool and its worker threads (structured-clone safe). */
import type { ReconstructInput, ReconstructOptions, SampleBlock, Target } from "../../shared/physics";
import type { EngineErrorCode } from "../../shared/physics/errors";

export interface BlockRequest {
  id: number;
  input: ReconstructInput;
  options: ReconstructOptions;
  fittedExpected: number[];
  seed: number;
  from: number;
  count: number;
  target: Target | null;
}

export type BlockReply =
  | { id: number; block: SampleBlock; error?: undefined }
  | { id: number; block?: undefined; error: { message: string; code: EngineErrorCode | null } };
