/**
 * One Monte Carlo worker thread: computes blocks of samples with the pure function of
 * shared/physics and posts them back. Input errors travel back as plain data. It warms the
 * engine up before it reports ready (monteCarloWarmUp.ts).
 */
import { parentPort } from "node:worker_threads";
import { monteCarloBlock } from "../../shared/physics/monteCarlo";
import { EngineInputError } from "../../shared/physics/errors";
import type { BlockRequest, BlockReply } from "./monteCarloProtocol";
import { warmUpEngine } from "./monteCarloWarmUp";

const port = parentPort;
if (!port) throw new Error("monteCarloWorker must run in a worker thread");

port.on("message", (request: BlockRequest) => {
  let reply: BlockReply;
  try {
    const { input, options, fittedExpected, seed, from, count, target } = request;
    reply = { id: request.id, block: monteCarloBlock(input, options, fittedExpected, seed, from, count, target) };
  } catch (e) {
    const error = e as Error;
    reply = { id: request.id, error: { message: error.message, code: e instanceof EngineInputError ? e.code : null } };
  }
  port.postMessage(reply);
});
warmUpEngine();
port.postMessage({ ready: true });
