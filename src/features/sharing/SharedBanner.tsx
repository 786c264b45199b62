import type { SharedViewDto } from "@shared/schemas/shares";
import { formatDate, formatDateTime } from "@shared/format/dates";

/** Says what the reader is looking at: a read-only share, since when and until when. */
export function SharedBanner({ share }: { share: SharedViewDto["share"] }) {
  const until = share.expiresAt ? `until ${formatDateTime(share.expiresAt)}` : "until the lab revokes it";
  return (
    <p className="mt-2 inline-block rounded-md bg-petrol-50 px-3 py-1.5 text-sm text-petrol-800 print:bg-transparent print:p-0">
      Shared read-only {share.kind === "guest" ? "with you" : "by link"} on {formatDate(share.createdAt)}; open {until}.
    </p>
  );
}
