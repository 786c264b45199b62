import { formatCount, formatNumber } from "@shared/format/uncertainty";
import { DensityBars2D } from "../../plots/DensityBars2D";
import { sharedScale } from "../../plots/densityModel";
import type { BellTarget } from "@shared/schemas/sources";
import { BELL_SYMBOL } from "../stateView/meritRows";
import { Spectrum } from "../stateView/Spectrum";
import { LOW_MEAN_COUNT, type EntryChecks } from "./entryChecks";

/**
 * The side panel of the counts grid: progress through the set, warnings as counts arrive,
 * and the linear estimate once every row is in. Nothing here is stored.
 */
export function EntryFeedback({ checks, labels, target }: { checks: EntryChecks; labels: string[]; target: BellTarget }) {
  const { filled, total, linear, figures } = checks;
  const warnings = warningsOf(checks, labels);
  return (
    <div className="space-y-3" aria-live="polite" aria-atomic="false">
      <div>
        <div className="flex items-baseline justify-between text-sm">
          <span className="font-bold">Rows with counts</span>
          <span className="num">
            {filled} / {total}
          </span>
        </div>
        <div className="mt-1 h-2 rounded bg-paper-sunk" role="progressbar" aria-label="Rows with counts" aria-valuemin={0} aria-valuemax={total} aria-valuenow={filled}>
          <div className="h-2 rounded bg-petrol-600" style={{ width: `${total ? (filled / total) * 100 : 0}%` }} />
        </div>
      </div>
      {warnings.length > 0 && (
        <ul className="space-y-1 text-sm" data-testid="entry-warnings">
          {warnings.map((w) => (
            <li key={w.text} className={`rounded border-l-4 px-2 py-1 ${w.tone === "error" ? "border-danger bg-danger-soft" : "border-caution-edge bg-caution-soft"}`}>
              {w.text}
            </li>
          ))}
        </ul>
      )}
      {checks.estimateNote && <p className="text-sm text-ink-soft">{checks.estimateNote}</p>}
      {linear && (
        <div data-testid="live-estimate">
          <p className="mb-1 text-sm font-bold">Linear estimate (not saved)</p>
          {figures && (
            <dl className="mb-2 grid grid-cols-[1fr_auto] gap-x-3 text-sm" data-testid="live-figures">
              <dt>Fidelity to {BELL_SYMBOL[target]}</dt>
              <dd className="num">{formatNumber(figures.fidelity, 3)}</dd>
              <dt>Concurrence</dt>
              <dd className="num">{formatNumber(figures.concurrence, 3)}</dd>
              <dt>Purity</dt>
              <dd className="num">{formatNumber(figures.purity, 3)}</dd>
              {!figures.physical && <dd className="col-span-2 text-xs text-ink-faint">from a non-physical estimate: indicative only</dd>}
            </dl>
          )}
          <DensityBars2D rho={linear.rho} scale={sharedScale(linear.rho)} stacked />
          <div className="mt-2">
            <Spectrum eigenvalues={linear.eigenvalues} physical={linear.physical} />
          </div>
        </div>
      )}
    </div>
  );
}

function warningsOf(checks: EntryChecks, labels: string[]): { tone: "error" | "caution"; text: string }[] {
  const out: { tone: "error" | "caution"; text: string }[] = [];
  const name = (i: number) => `row ${i + 1} (${labels[i] || "unnamed"})`;
  if (checks.unreadable.length) out.push({ tone: "error", text: `Not a whole number of counts: ${checks.unreadable.map(name).join(", ")}.` });
  for (const o of checks.outliers) {
    out.push({
      tone: "caution",
      text: `${name(o.row)}: ${o.counts} counts, but the other rows imply about ${formatCount(o.expected)}. A typo, or a waveplate at the wrong angle?`,
    });
  }
  if (checks.zeros.length) {
    out.push({ tone: "caution", text: `Zero counts in ${checks.zeros.map(name).join(", ")}. Fine where the state has no weight; otherwise check the detectors and the timing.` });
  }
  if (checks.lowCounts) out.push({ tone: "caution", text: `Fewer than ${LOW_MEAN_COUNT} counts per row on average: the uncertainties will be large. Longer exposures help.` });
  if (checks.linear && !checks.linear.physical) {
    out.push({ tone: "caution", text: "The linear estimate has a negative eigenvalue, so it is not a physical state. Saving also computes maximum likelihood, which always is." });
  }
  return out;
}
