import { MonteCarloPool } from "../workers/monteCarloPool";

let pool: MonteCarloPool | undefined;

/**
 * The process's one Monte Carlo pool (worker threads), started on first use. Its idle threads
 * are unref'd, so it never keeps a process alive.
 */
export function monteCarloPool(): MonteCarloPool {
  pool ??= new MonteCarloPool();
  return pool;
}
