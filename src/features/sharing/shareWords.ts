import type { ShareItemType, ShareStatus } from "@shared/schemas/shares";
import { formatDate } from "@shared/format/dates";

export const ITEM_LABEL: Record<ShareItemType, string> = { session: "Lab session", run: "Run", reconstruction: "Reconstructed state" };

/** Button words: a run page carries both the run's and the shown state's buttons. */
export const ITEM_SHORT: Record<ShareItemType, string> = { session: "session", run: "run", reconstruction: "state" };

/** Status words; the badge adds a shape, so the state never rests on colour alone. */
export const STATUS_WORDS: Record<ShareStatus, { tone: "up" | "down" | "pending"; label: (expiresAt: string | null) => string }> = {
  active: { tone: "up", label: (e) => (e ? `Open until ${formatDate(e)}` : "Open") },
  expired: { tone: "pending", label: (e) => `Expired ${e ? formatDate(e) : ""}`.trim() },
  revoked: { tone: "down", label: () => "Revoked" },
};

/** How long a new share stays open. */
export const EXPIRY_CHOICES = [
  { value: "7", label: "7 days" },
  { value: "30", label: "30 days" },
  { value: "90", label: "90 days" },
  { value: "1", label: "1 day" },
  { value: "never", label: "Until revoked" },
] as const;
export type ExpiryChoice = (typeof EXPIRY_CHOICES)[number]["value"];

export function expiryFrom(choice: ExpiryChoice, now = Date.now()): string | null {
  return choice === "never" ? null : new Date(now + Number(choice) * 86_400_000).toISOString();
}
