import type { ApiRouter } from "../http/endpoint";
import { accountRouter } from "./account";
import { acquisitionRouter } from "./acquisition";
import { apiTokensRouter } from "./apiTokens";
import { attachmentsRouter } from "./attachments";
import { authRouter } from "./auth";
import { batchesRouter } from "./batches";
import { bellRouter } from "./bell";
import { compareRouter } from "./compare";
import { devOutboxRouter } from "./devOutbox";
import { fringeRouter } from "./fringe";
import { invitationsRouter, labInvitationsRouter } from "./invitations";
import { labHomeRouter } from "./labHome";
import { labSessionsRouter } from "./labSessions";
import { labsRouter } from "./labs";
import { membersRouter } from "./members";
import { openApiRouter } from "./openapi";
import { reconstructionsRouter } from "./reconstructions";
import { runsRouter } from "./runs";
import { sourcesRouter } from "./sources";
import { trendsRouter } from "./trends";
import { sharesRouter } from "./shares";
import { guestSharesRouter, sharedViewRouter } from "./sharedView";
import { exportsRouter } from "./exports";
import { bundlesRouter } from "./bundles";

/** Every API router, mounted under /api by app.ts. Add new resources here. */
export const apiRouters: ApiRouter[] = [openApiRouter, authRouter, labsRouter, sourcesRouter, labSessionsRouter, runsRouter, reconstructionsRouter, attachmentsRouter, compareRouter, labHomeRouter, accountRouter, membersRouter, labInvitationsRouter, invitationsRouter, devOutboxRouter, bellRouter, fringeRouter, trendsRouter, apiTokensRouter, batchesRouter, acquisitionRouter, sharesRouter, sharedViewRouter, guestSharesRouter, exportsRouter, bundlesRouter];
