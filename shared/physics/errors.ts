/** Errors the engine raises for bad input; `code` is stable for the API layer to map. */
export type EngineErrorCode = "invalid_input" | "informationally_incomplete" | "no_counts" | "not_two_qubits";

export class EngineInputError extends Error {
  readonly code: EngineErrorCode;
  constructor(code: EngineErrorCode, message: string) {
    super(message);
    this.name = "EngineInputError";
    this.code = code;
  }
}
