type Tone = "up" | "down" | "pending";

const TONES: Record<Tone, { cls: string; glyph: string }> = {
  up: { cls: "bg-success-soft text-success", glyph: "●" },
  down: { cls: "bg-danger-soft text-danger", glyph: "■" },
  pending: { cls: "bg-paper-sunk text-ink-soft", glyph: "○" },
};

/** A state shown by word and by shape, never by colour alone. */
export function StatusBadge({ tone, children }: { tone: Tone; children: React.ReactNode }) {
  const t = TONES[tone];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full px-2.5 py-0.5 text-sm font-bold ${t.cls}`}>
      <span aria-hidden="true">{t.glyph}</span>
      {children}
    </span>
  );
}
