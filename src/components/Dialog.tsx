import { useEffect, useId, useRef } from "react";

/**
 * A modal built on the native <dialog> element: focus is trapped and Escape closes it without
 * any code of ours; `onClose` runs for every way of closing.
 */
export function Dialog({ open, title, onClose, children, actions }: { open: boolean; title: string; onClose: () => void; children: React.ReactNode; actions: React.ReactNode }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog ref={ref} aria-labelledby={titleId} onClose={onClose} className="m-auto max-w-lg rounded-lg border border-paper-sunk bg-paper-raised p-0 shadow-xl backdrop:bg-ink/40">
      <div className="p-5">
        <h2 id={titleId} className="text-lg font-bold text-ink">
          {title}
        </h2>
        <div className="mt-2 text-ink-soft">{children}</div>
        <div className="mt-5 flex justify-end gap-2">{actions}</div>
      </div>
    </dialog>
  );
}
