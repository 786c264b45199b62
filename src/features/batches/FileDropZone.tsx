import { useId, useRef, useState } from "react";
import { buttonClass } from "../../components/Button";
import { ACCEPT } from "./batchFileChecks";

/**
 * Where files are dropped (or chosen with the button, which keyboard users reach by Tab). The
 * zone only collects files; the list and the upload are the caller's.
 */
export function FileDropZone({ onFiles, disabled }: { onFiles: (files: File[]) => void; disabled?: boolean }) {
  const [over, setOver] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  const hintId = useId();
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        if (!disabled) onFiles([...e.dataTransfer.files]);
      }}
      className={`flex flex-col items-center justify-center gap-3 rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors ${over ? "border-petrol-500 bg-petrol-50" : "border-ink-faint bg-paper"}`}
    >
      <p className="text-lg font-bold text-ink">Drop run files here</p>
      <p id={hintId} className="max-w-prose text-sm text-ink-soft">
        One-run CSV or JSON files, sweep CSV files (one run per line), or .zip archives of them — as many as a sweep produced.
      </p>
      <button type="button" className={buttonClass("secondary")} onClick={() => input.current?.click()} disabled={disabled} aria-describedby={hintId}>
        Choose files…
      </button>
      <input
        ref={input}
        type="file"
        multiple
        accept={ACCEPT}
        className="sr-only"
        tabIndex={-1}
        aria-hidden="true"
        onChange={(e) => {
          onFiles([...(e.target.files ?? [])]);
          e.target.value = "";
        }}
      />
    </div>
  );
}
