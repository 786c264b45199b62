/**
 * A pool of worker threads for Monte Carlo uncertainties. A run is cut into blocks of
 * consecutive sample indices; sample i always uses random stream i of the seed, and the blocks
 * are summarised in index order, so the result is identical to the single-thread
 * `monteCarlo()` of shared/physics for the same seed.
 *
 * Works under tsx and vitest alike: each thread starts from monteCarloWorker.mjs, which
 * registers tsx before importing the TypeScript worker. Idle threads are unref'd, so a
 * forgotten pool never keeps the process alive; call close() to end them.
 */
import { Worker } from "node:worker_threads";
import { availableParallelism } from "node:os";
import {
  EngineInputError, reconstruct, resolveSamples, summariseMonteCarlo,
  type MonteCarloOptions, type MonteCarloResult, type Reconstruction, type ReconstructInput, type ReconstructOptions, type SampleBlock,
} from "../../shared/physics";
import type { BlockReply, BlockRequest } from "./monteCarloProtocol";

const WORKER_ENTRY = new URL("./monteCarloWorker.mjs", import.meta.url);
/** Blocks per thread and run: small enough to balance, large enough to amortise messages. */
const BLOCKS_PER_THREAD = 4;

interface PoolThread {
  worker: Worker;
  ready: Promise<void>;
  pending: Map<number, { resolve: (b: SampleBlock) => void; reject: (e: Error) => void }>;
}

export class MonteCarloPool {
  private threads: PoolThread[] | null = null;
  private nextId = 1;
  private nextThread = 0;

  constructor(readonly size = Math.max(1, availableParallelism())) {}

  /** Starts the threads now rather than on the first run (e.g. when a server boots). */
  async start(): Promise<void> {
    await Promise.all(this.spawn().map((t) => t.ready));
  }

  async run(input: ReconstructInput, options: ReconstructOptions, mc: MonteCarloOptions = {}, base?: Reconstruction): Promise<MonteCarloResult> {
    const { samples, seed } = resolveSamples(mc);
    const fitted = base ?? reconstruct(input, options);
    const target = mc.target === undefined ? "phi+" : mc.target;
    const threads = this.spawn();
    const blockSize = Math.max(1, Math.ceil(samples / (threads.length * BLOCKS_PER_THREAD)));
    const jobs: Promise<SampleBlock>[] = [];
    for (let from = 0; from < samples; from += blockSize) {
      const request: BlockRequest = {
        id: this.nextId++, input, options, fittedExpected: fitted.expectedCounts, seed, from, count: Math.min(blockSize, samples - from), target,
      };
      jobs.push(this.send(threads[this.nextThread++ % threads.length], request));
    }
    return summariseMonteCarlo(await Promise.all(jobs), seed, options.method);
  }

  async close(): Promise<void> {
    const threads = this.threads ?? [];
    this.threads = null;
    await Promise.all(threads.map((t) => t.worker.terminate()));
  }

  private spawn(): PoolThread[] {
    if (this.threads) return this.threads;
    this.threads = Array.from({ length: this.size }, () => {
      const worker = new Worker(WORKER_ENTRY);
      const pending: PoolThread["pending"] = new Map();
      // Referenced until it reports ready, so that awaiting start() keeps the process alive.
      const ready = new Promise<void>((resolve, reject) => {
        worker.once("message", () => {
          if (pending.size === 0) worker.unref();
          resolve();
        });
        worker.once("error", reject);
      });
      worker.on("message", (reply: BlockReply | { ready: true }) => {
        if ("ready" in reply) return;
        const job = pending.get(reply.id);
        if (!job) return;
        pending.delete(reply.id);
        if (pending.size === 0) worker.unref();
        if (reply.block) job.resolve(reply.block);
        else job.reject(reply.error.code ? new EngineInputError(reply.error.code, reply.error.message) : new Error(reply.error.message));
      });
      worker.on("error", (error) => {
        for (const job of pending.values()) job.reject(error);
        pending.clear();
      });
      // A thread that dies takes the pool with it; the next run starts fresh threads.
      worker.on("exit", (code) => {
        for (const job of pending.values()) job.reject(new Error(`Monte Carlo worker stopped (exit code ${code})`));
        pending.clear();
        if (this.threads?.some((t) => t.worker === worker)) void this.close();
      });
      return { worker, ready, pending };
    });
    return this.threads;
  }

  private send(thread: PoolThread, request: BlockRequest): Promise<SampleBlock> {
    return new Promise((resolve, reject) => {
      thread.pending.set(request.id, { resolve, reject });
      thread.worker.ref();
      thread.worker.postMessage(request);
    });
  }
}
