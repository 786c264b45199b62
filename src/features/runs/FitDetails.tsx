import { formatCount, formatNumber } from "@shared/format/uncertainty";
import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import { METHOD_NAME } from "../stateView/meritRows";
import { formatDateTime } from "@shared/format/dates";

/** Method, likelihood, iterations, engine version and seed: what it takes to reproduce the numbers. */
export function FitDetails({ reconstruction: r }: { reconstruction: ReconstructionDto }) {
  const items: [string, React.ReactNode][] = [
    ["Method", METHOD_NAME[r.method]],
    ["Counts used", formatCount(r.counts.total)],
    ["Log-likelihood L", r.fit.logLikelihood === null ? "—" : formatNumber(r.fit.logLikelihood, 7)],
    ["Iterations", r.fit.iterations ?? "—"],
    ["Converged", r.fit.converged === null ? "not iterative" : r.fit.converged ? `yes (tolerance ${formatNumber(r.fit.tolerance, 2)})` : "no"],
    ["Monte Carlo", r.uncertainties ? `${r.uncertainties.samples} samples, seed ${r.uncertainties.seed}` : "none"],
    ["Handedness", r.conventions.handedness],
    ["Engine", r.engineVersion],
    ["Computed", formatDateTime(r.createdAt)],
  ];
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
      {items.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-faint">{k}</dt>
          <dd className="tabular-nums">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
