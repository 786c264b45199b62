import { Router } from "express";
import type { DataSource } from "typeorm";
import { HealthSchema, type Health } from "@shared/schemas/health";

const startedAt = Date.now();

/** GET /api/health — the API and the database, with 503 when the database does not answer. */
export function healthRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get("/health", async (_req, res) => {
    const api = { status: "up" as const, version: process.env.npm_package_version ?? "0.1.0", uptimeSeconds: Math.round((Date.now() - startedAt) / 1000) };
    const t0 = performance.now();
    let body: Health;
    try {
      const rows: Array<{ version: string }> = await dataSource.query("select current_setting('server_version') as version");
      body = { status: "ok", api, database: { status: "up", latencyMs: Math.round((performance.now() - t0) * 10) / 10, version: rows[0].version } };
    } catch (err) {
      body = { status: "degraded", api, database: { status: "down", error: err instanceof Error ? err.message : String(err) } };
    }
    res.status(body.status === "ok" ? 200 : 503).json(HealthSchema.parse(body));
  });
  return router;
}
