import type { ApiRouter } from "../http/endpoint";
import { authRouter } from "./auth";
import { labsRouter } from "./labs";
import { openApiRouter } from "./openapi";

/** Every API router, mounted under /api by app.ts. Add new resources here. */
export const apiRouters: ApiRouter[] = [openApiRouter, authRouter, labsRouter];
