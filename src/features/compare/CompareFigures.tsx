import type { CompareDto } from "@shared/schemas/compare";
import { FIDELITY_KEY, type MetricKey } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import { formatNumber, formatWithUncertainty } from "@shared/format/uncertainty";
import { ValueWithError } from "../../components/ValueWithError";
import { BELL_SYMBOL } from "../stateView/meritRows";

const ROWS: { key: MetricKey | "target"; label: string }[] = [
  { key: "target", label: "Fidelity to the source's target" },
  { key: "phaseFidelityPsi", label: "Fidelity, best phase (HV/VH)" },
  { key: "phaseFidelityPhi", label: "Fidelity, best phase (HH/VV)" },
  { key: "concurrence", label: "Concurrence" },
  { key: "tangle", label: "Tangle" },
  { key: "purity", label: "Purity" },
  { key: "linearEntropy", label: "Linear entropy" },
  { key: "vonNeumannEntropy", label: "Von Neumann entropy (bits)" },
  { key: "negativity", label: "Negativity" },
  { key: "chshMax", label: "Largest CHSH value" },
];

/** One column per run: each figure ± σ, and below it the difference to the first run ± σ. */
export function CompareFigures({ compare }: { compare: CompareDto }) {
  const [first] = compare.items;
  const keyOf = (row: (typeof ROWS)[number], target: string): MetricKey => (row.key === "target" ? FIDELITY_KEY[target as BellTarget] : row.key);
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Figures of merit of each run and their differences to the first</caption>
        <thead>
          <tr className="border-b-2 border-paper-sunk">
            <th scope="col" className="px-2 py-1 text-left">Figure</th>
            {compare.items.map(({ run }) => (
              <th key={run.id} scope="col" className="px-2 py-1 text-right">
                {run.name}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {ROWS.map((row) => (
            <tr key={row.key} className="border-b border-paper-sunk align-top">
              <th scope="row" className="px-2 py-1 text-left font-bold">
                {row.key === "target" ? `Fidelity to ${BELL_SYMBOL[first.run.source.targetState as BellTarget] ?? "target"}` : row.label}
              </th>
              {compare.items.map(({ run, reconstruction: r }, i) => {
                const key = keyOf(row, first.run.source.targetState);
                const diff = compare.differences.find((d) => d.runId === run.id)?.metrics[key];
                return (
                  <td key={run.id} className="num px-2 py-1">
                    <ValueWithError value={r.metrics[key]} uncertainty={r.uncertainties?.metrics[key]} />
                    {i > 0 && diff && <div className="text-xs text-ink-soft">Δ {signed(formatWithUncertainty(diff.delta, diff.uncertainty).text)}</div>}
                  </td>
                );
              })}
            </tr>
          ))}
          <tr className="border-b border-paper-sunk">
            <th scope="row" className="px-2 py-1 text-left font-bold">Trace distance to the first</th>
            {compare.items.map(({ run }, i) => (
              <td key={run.id} className="num px-2 py-1">
                {i === 0 ? "—" : formatNumber(compare.differences.find((d) => d.runId === run.id)?.traceDistance, 3)}
              </td>
            ))}
          </tr>
          <tr>
            <th scope="row" className="px-2 py-1 text-left font-bold">Fidelity between the states</th>
            {compare.items.map(({ run }, i) => (
              <td key={run.id} className="num px-2 py-1">
                {i === 0 ? "—" : formatNumber(compare.differences.find((d) => d.runId === run.id)?.fidelityBetween, 4)}
              </td>
            ))}
          </tr>
        </tbody>
      </table>
    </div>
  );
}

const signed = (t: string) => (t.startsWith("−") || t === "—" ? t : `+${t}`);
