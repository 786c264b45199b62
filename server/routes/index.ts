import type { ApiRouter } from "../http/endpoint";
import { accountRouter } from "./account";
import { authRouter } from "./auth";
import { bellRouter } from "./bell";
import { devOutboxRouter } from "./devOutbox";
import { fringeRouter } from "./fringe";
import { invitationsRouter, labInvitationsRouter } from "./invitations";
import { labSessionsRouter } from "./labSessions";
import { labsRouter } from "./labs";
import { membersRouter } from "./members";
import { openApiRouter } from "./openapi";
import { sourcesRouter } from "./sources";
import { trendsRouter } from "./trends";

/** Every API router, mounted under /api by app.ts. Add new resources here. */
export const apiRouters: ApiRouter[] = [openApiRouter, authRouter, labsRouter, sourcesRouter, labSessionsRouter, accountRouter, membersRouter, labInvitationsRouter, invitationsRouter, devOutboxRouter, bellRouter, fringeRouter, trendsRouter];
