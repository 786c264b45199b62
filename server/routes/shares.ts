import { LabIdParamsSchema } from "@shared/schemas/labs";
import { CreateShareSchema, CreatedShareSchema, ShareListQuerySchema, ShareListSchema, ShareParamsSchema, ShareSchema } from "@shared/schemas/shares";
import { ApiRouter } from "../http/endpoint";
import { sharePolicy } from "../policies/shares";
import { presentShare } from "../presenters/sharedAccess";
import { shareLinkUrl } from "../services/shareMail";
import { createShare, listShares, revokeShare } from "../services/shares";

/** A lab's shares of its sessions, runs and reconstructions: list, create, revoke. */
export const sharesRouter = new ApiRouter("/labs");
const tags = ["shares"];

sharesRouter.get("/:labId/shares", { summary: "Shares of the lab, or of one item (itemType + itemId), newest first", auth: "user", tags, params: LabIdParamsSchema, query: ShareListQuerySchema, response: ShareListSchema }, async ({ user, params, query }) => {
  await sharePolicy.list(user, params.labId);
  return { data: (await listShares(params.labId, query)).map((s) => presentShare(s.share, s.itemTitle)) };
});

sharesRouter.post(
  "/:labId/shares",
  { summary: "Share an item read-only: a secret link (its token is shown once) or a guest invitation by e-mail", auth: "user", tags, params: LabIdParamsSchema, body: CreateShareSchema, response: CreatedShareSchema, status: 201 },
  async ({ user, params, body }) => {
    await sharePolicy.create(user, params.labId);
    const { share, itemTitle, token, mail } = await createShare(user, params.labId, body);
    return { share: presentShare(share, itemTitle), link: token ? { url: shareLinkUrl(token), token } : null, mail };
  },
);

sharesRouter.post("/:labId/shares/:shareId/revoke", { summary: "Revoke a share: its link or guest access stops working at once (410)", auth: "user", tags, params: ShareParamsSchema, response: ShareSchema }, async ({ user, params }) => {
  await sharePolicy.revoke(user, params.labId);
  const { share, itemTitle } = await revokeShare(user, params.labId, params.shareId);
  return presentShare(share, itemTitle);
});
