import { config } from "../config";
import type { Share } from "../entities/Share";
import type { OutgoingMail } from "../mail/mailer";
import type { SnapshotData } from "./shareSnapshots";

/** Where a link share opens: the token travels in the page path, which the server never logs. */
export function shareLinkUrl(token: string): string {
  return `${config().publicUrl}/shared/${encodeURIComponent(token)}`;
}

/** Where a guest opens a share after signing in with the invited address. */
export function guestShareUrl(shareId: string): string {
  return `${config().publicUrl}/guest/${shareId}`;
}

const ITEM_WORDS = { session: "the lab session", run: "the run", reconstruction: "the reconstructed state" } as const;

/** Plain text, one link; says what is shared, by whom, until when, and how to get in. */
export function guestShareMail(to: string, data: SnapshotData, itemTitle: string, sharer: string, share: Share, message: string): OutgoingMail {
  const lab = data.lab.institution ? `${data.lab.name} (${data.lab.institution})` : data.lab.name;
  const until = share.expiresAt ? `It stays open until ${share.expiresAt.toUTCString()}.` : "It stays open until the lab revokes it.";
  const note = message ? `\n\n${sharer} adds: “${message}”` : "";
  return {
    to,
    subject: `${sharer} shared “${itemTitle}” with you on Rhomb`,
    text:
      `Hello,\n\n${sharer} of ${lab} shared ${ITEM_WORDS[share.itemType]} “${itemTitle}” with you on Rhomb, read-only.${note}\n\n` +
      `Open it here after signing in with this e-mail address (${to}); if you have no Rhomb account yet, sign up with this address first:\n\n${guestShareUrl(share.id)}\n\n${until}` +
      "\n\n— Rhomb, the shared two-photon tomography notebook\nIf you did not expect this message, you can ignore it.",
  };
}
