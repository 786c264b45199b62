import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import { ValueWithError } from "../../components/ValueWithError";
import { METHOD_NAME, meritRows, otherBellFidelities, type MeritRow } from "./meritRows";

/** The figures of merit of one reconstruction, each with its Monte Carlo σ and the method named. */
export function ScoreCard({ reconstruction, target }: { reconstruction: ReconstructionDto; target: BellTarget }) {
  const { metrics, uncertainties, physical, method } = reconstruction;
  const sigma = uncertainties?.metrics;
  return (
    <div>
      <p className="mb-2 text-sm text-ink-soft">
        {METHOD_NAME[method]}
        {uncertainties ? `; ± one standard deviation from ${uncertainties.samples} Monte Carlo samples (seed ${uncertainties.seed})` : "; no Monte Carlo uncertainties computed"}.
        {!physical && <strong className="ml-1 text-danger">Computed from a non-physical estimate.</strong>}
      </p>
      <table className="w-full text-sm" data-testid="scorecard">
        <caption className="sr-only">Figures of merit</caption>
        <tbody>
          {meritRows(metrics, sigma, target).map((row) => (
            <MeritLine key={row.key} row={row} />
          ))}
        </tbody>
      </table>
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer font-bold text-petrol-700">Fidelity to the other Bell states</summary>
        <table className="mt-1 w-full">
          <tbody>
            {otherBellFidelities(metrics, sigma, target).map((row) => (
              <MeritLine key={row.key} row={row} />
            ))}
          </tbody>
        </table>
      </details>
    </div>
  );
}

function MeritLine({ row }: { row: MeritRow }) {
  return (
    <tr className="border-t border-paper-sunk" data-metric={row.key}>
      <th scope="row" className="py-1.5 pr-3 text-left font-normal">
        <span className="font-bold text-ink">{row.label}</span>
        {row.hint && <span className="ml-1.5 text-xs text-ink-faint">{row.hint}</span>}
      </th>
      <td className="num py-1.5 text-base">
        <ValueWithError value={row.value} uncertainty={row.uncertainty} unit={row.unit} />
        {row.companion && (
          <span className="block text-xs text-ink-soft">
            at {row.companion.label} = <ValueWithError value={row.companion.value} uncertainty={row.companion.uncertainty} />
            {row.companion.suffix}
          </span>
        )}
      </td>
    </tr>
  );
}
