import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";

/**
 * Real Rhomb processes for tests that must stop and restart them: the web server
 * (server/index.ts) and the queue worker (server/jobs/worker.ts), against this test run's
 * database. They run as `node --import tsx …`, one process each: the tsx command would put a
 * second process in between, and killing that one leaves the real server running.
 */
export interface RhombProcess {
  child: ChildProcess;
  output: () => string;
  /** Resolves with the exit code (or the signal's name). */
  exited: Promise<number | string>;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

export async function startRhombProcess(entry: "server/index.ts" | "server/jobs/worker.ts", env: Record<string, string>, readyText: string): Promise<RhombProcess> {
  const child = spawn(process.execPath, ["--import", "tsx", entry], {
    env: { ...process.env, NODE_ENV: "test", LOG_LEVEL: "info", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let text = "";
  child.stdout!.on("data", (d) => (text += d));
  child.stderr!.on("data", (d) => (text += d));
  const exited = new Promise<number | string>((resolve) => child.once("exit", (code, signal) => resolve(code ?? signal ?? "unknown")));
  const deadline = Date.now() + 30_000;
  while (!text.includes(readyText)) {
    if (child.exitCode !== null || Date.now() > deadline) throw new Error(`${entry} did not start:\n${text}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return { child, output: () => text, exited };
}
