import { PHYSICAL_TOLERANCE } from "@shared/physics";
import { formatFixed } from "@shared/format/uncertainty";
import { PALETTE } from "../../plots/palette";

/**
 * Eigenvalues of ρ, largest first, as numbers and bars. A negative eigenvalue means the estimate
 * is not a physical state; it is shown, never hidden (physics contract §4).
 */
export function Spectrum({ eigenvalues, physical }: { eigenvalues: number[]; physical: boolean }) {
  const max = Math.max(1e-12, ...eigenvalues.map(Math.abs));
  return (
    <div>
      <p className="mb-2 text-sm">
        {physical ? (
          <span className="font-bold text-success">All eigenvalues ≥ 0: a physical state.</span>
        ) : (
          <span className="inline-flex items-center gap-1.5 rounded-full bg-danger-soft px-2.5 py-0.5 font-bold text-danger" data-testid="not-physical">
            <span aria-hidden="true">■</span> Not physical: a negative eigenvalue
          </span>
        )}
      </p>
      <ol className="space-y-1" aria-label="Eigenvalues, largest first">
        {eigenvalues.map((v, i) => {
          const negative = v < -PHYSICAL_TOLERANCE;
          return (
          <li key={i} className="grid grid-cols-[2rem_5rem_1fr] items-center gap-2 text-sm">
            <span className="text-ink-faint">λ{subscript(i + 1)}</span>
            <span className={`num ${negative ? "font-bold text-danger" : ""}`}>{formatFixed(v, 4)}</span>
            <span className="relative h-3 rounded-sm bg-paper-sunk" aria-hidden="true">
              <span
                className="absolute top-0 h-3 rounded-sm"
                style={{ width: `${(Math.abs(v) / max) * 100}%`, background: negative ? PALETTE.negative : PALETTE.positive }}
              />
            </span>
          </li>
          );
        })}
      </ol>
    </div>
  );
}

function subscript(n: number): string {
  return String(n).replace(/\d/g, (d) => "₀₁₂₃₄₅₆₇₈₉"[Number(d)]);
}
