type Kind = "error" | "caution" | "info" | "success";

const KINDS: Record<Kind, { cls: string; label: string }> = {
  error: { cls: "border-danger bg-danger-soft text-danger", label: "Error" },
  caution: { cls: "border-caution-edge bg-caution-soft text-caution", label: "Caution" },
  info: { cls: "border-petrol-100 bg-petrol-50 text-petrol-800", label: "Note" },
  success: { cls: "border-success bg-success-soft text-success", label: "Done" },
};

/** A message box; errors are announced to screen readers. */
export function Alert({ kind = "info", title, children }: { kind?: Kind; title?: string; children: React.ReactNode }) {
  const k = KINDS[kind];
  return (
    <div role={kind === "error" ? "alert" : "status"} className={`rounded-md border-l-4 px-4 py-3 ${k.cls}`}>
      <p className="font-bold">{title ?? k.label}</p>
      <div className="mt-1 text-ink">{children}</div>
    </div>
  );
}
