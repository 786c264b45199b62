import type { BatchFileStatus } from "@shared/schemas/batches";

/** Each status by word and by shape, never by colour alone. */
export const STATUS_LOOK: Record<BatchFileStatus, { label: string; glyph: string; cls: string }> = {
  queued: { label: "Queued", glyph: "○", cls: "bg-paper-sunk text-ink-soft" },
  processing: { label: "Reconstructing", glyph: "◐", cls: "bg-petrol-50 text-petrol-800" },
  stored: { label: "Stored", glyph: "●", cls: "bg-success-soft text-success" },
  failed: { label: "Not stored", glyph: "■", cls: "bg-danger-soft text-danger" },
  duplicate: { label: "Already stored", glyph: "◆", cls: "bg-caution-soft text-caution" },
};

export function BatchStatusBadge({ status }: { status: BatchFileStatus }) {
  const look = STATUS_LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-2.5 py-0.5 text-sm font-bold ${look.cls}`}>
      <span aria-hidden="true">{look.glyph}</span>
      {look.label}
    </span>
  );
}
