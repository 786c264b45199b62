import fs from "node:fs";
import path from "node:path";
import express, { type Express } from "express";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import type { DataSource } from "typeorm";
import type { Config } from "./config";
import { logger } from "./logger";
import { apiNotFound, errorMiddleware } from "./http/errorMiddleware";
import { refreshSession, sessionMiddleware } from "./http/session";
import { csrfProtection } from "./http/csrf";
import { loadUser } from "./http/auth";
import { tokenAuth } from "./http/tokenAuth";
import { refuseNonUtf8Json, refuseNulInJson } from "./http/utf8Body";
import { healthRouter } from "./routes/health";
import { apiRouters } from "./routes/index";

export interface AppDeps {
  config: Config;
  dataSource: DataSource;
}

/** Builds the Express app: API under /api, the built client everywhere else. Tests import this. */
export function createApp({ config, dataSource }: AppDeps): Express {
  const app = express();
  app.disable("x-powered-by");
  if (config.TRUST_PROXY) app.set("trust proxy", config.TRUST_PROXY === "true" ? true : config.TRUST_PROXY);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          "img-src": ["'self'", "data:", "blob:"],
          "style-src": ["'self'", "'unsafe-inline'"],
          "worker-src": ["'self'", "blob:"],
          "upgrade-insecure-requests": null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(
    pinoHttp({
      logger,
      // One short line per API request; static files and health probes are not worth a line.
      autoLogging: { ignore: (req) => !req.url?.startsWith("/api/") || req.url === "/api/health" },
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: "2mb", verify: refuseNonUtf8Json }), refuseNulInJson);
  api.use(healthRouter(dataSource));
  api.use(sessionMiddleware(config, dataSource));
  api.use(csrfProtection);
  api.use(loadUser);
  api.use(refreshSession);
  api.use(tokenAuth);
  for (const r of apiRouters) api.use(r.prefix, r.router);
  api.use(apiNotFound);
  app.use("/api", api);

  serveClient(app, path.resolve(config.RHOMB_STATIC_DIR));
  app.use(errorMiddleware);
  return app;
}

/** The built React client, with index.html as the fallback for client-side routes. */
function serveClient(app: Express, dir: string): void {
  const indexHtml = path.join(dir, "index.html");
  if (!fs.existsSync(indexHtml)) return;
  app.use("/assets", express.static(path.join(dir, "assets"), { immutable: true, maxAge: "1y", fallthrough: false }));
  app.use(express.static(dir, { index: false }));
  app.get(/^(?!\/api\/).*/, (_req, res) => {
    res.setHeader("Cache-Control", "no-cache");
    res.sendFile(indexHtml);
  });
}
