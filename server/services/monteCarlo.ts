import { MonteCarloPool } from "../workers/monteCarloPool";

let pool: MonteCarloPool | undefined;

/**
 * The process's one Monte Carlo pool (worker threads), started on first use unless
 * startMonteCarloPool ran at boot. Its idle threads are unref'd, so it never keeps a process
 * alive.
 */
export function monteCarloPool(): MonteCarloPool {
  pool ??= new MonteCarloPool();
  return pool;
}

/**
 * Starts the pool's threads now (each loads the engine and warms it up, about 1–2 s), so that
 * the first uncertainty request does not wait for them. Call once at boot; failures are left to
 * the caller to log (the next run starts fresh threads).
 */
export function startMonteCarloPool(): Promise<void> {
  return monteCarloPool().start();
}
