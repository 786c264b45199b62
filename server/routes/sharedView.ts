import { GuestShareListSchema, GuestShareParamsSchema, SharedViewSchema, ShareTokenSchema } from "@shared/schemas/shares";
import { ApiRouter } from "../http/endpoint";
import { presentGuestShare } from "../presenters/sharedAccess";
import { presentSharedView } from "../presenters/sharedSnapshot";
import { listGuestShares, openGuestShare, openLinkShare } from "../services/shares";

const tags = ["shared view"];

/**
 * Opening a share link needs no account. The token travels in the body, not the URL, so it
 * stays out of request logs (as invitation links do).
 */
export const sharedViewRouter = new ApiRouter("/shared");

sharedViewRouter.post("/view", { summary: "What a share link opens (read-only); 404 unknown link, 410 expired or revoked", auth: "public", tags, body: ShareTokenSchema, response: SharedViewSchema }, async ({ body }) => {
  const { share, data } = await openLinkShare(body.token);
  return presentSharedView(share, data);
});

/** Guests: items shared with the signed-in account's e-mail address. */
export const guestSharesRouter = new ApiRouter("/guest");

guestSharesRouter.get("/shares", { summary: "Everything shared with your e-mail address, with its status", auth: "user", tags, response: GuestShareListSchema }, async ({ user }) => {
  return { data: (await listGuestShares(user)).map((s) => presentGuestShare(s.share, s.itemTitle)) };
});

guestSharesRouter.get("/shares/:shareId", { summary: "One item shared with your address (read-only); 410 when expired or revoked", auth: "user", tags, params: GuestShareParamsSchema, response: SharedViewSchema }, async ({ user, params }) => {
  const { share, data } = await openGuestShare(user, params.shareId);
  return presentSharedView(share, data);
});
