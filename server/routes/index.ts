import type { ApiRouter } from "../http/endpoint";
import { authRouter } from "./auth";
import { labSessionsRouter } from "./labSessions";
import { labsRouter } from "./labs";
import { openApiRouter } from "./openapi";
import { sourcesRouter } from "./sources";

/** Every API router, mounted under /api by app.ts. Add new resources here. */
export const apiRouters: ApiRouter[] = [openApiRouter, authRouter, labsRouter, sourcesRouter, labSessionsRouter];
