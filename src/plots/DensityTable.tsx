import { formatWithUncertainty } from "@shared/format/uncertainty";
import { basisLabels, PART_NAME, type ComplexMatrix, type Part } from "./densityModel";

/**
 * ρ as tables of numbers with their uncertainties: the accessible view of the state. Re and Im
 * sit side by side only on wide screens: with uncertainties a 4×4 table needs about 580 px, and
 * on paper a clipped scroll box would hide columns, so print stacks them.
 */
export function DensityTable({ rho, sigma }: { rho: ComplexMatrix; sigma?: ComplexMatrix | null }) {
  return (
    <div className="grid gap-4 2xl:grid-cols-2 print:grid-cols-1">
      {(["re", "im"] as const).map((part) => (
        <PartTable key={part} part={part} rho={rho} sigma={sigma} />
      ))}
    </div>
  );
}

function PartTable({ part, rho, sigma }: { part: Part; rho: ComplexMatrix; sigma?: ComplexMatrix | null }) {
  const labels = basisLabels(rho.re.length);
  return (
    <div className="overflow-x-auto print:overflow-visible">
      <table className="w-full border-collapse text-sm">
        <caption className="mb-1 text-left font-bold text-ink">
          {PART_NAME[part]} ρ{sigma ? " (± one standard deviation)" : ""}
        </caption>
        <thead>
          <tr>
            <th scope="col" className="px-2 py-1 text-left text-ink-faint">
              <span className="sr-only">row</span>
            </th>
            {labels.map((l) => (
              <th key={l} scope="col" className="px-2 py-1 text-right font-bold">
                {l}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rho[part].map((row, i) => (
            <tr key={labels[i]} className="border-t border-paper-sunk">
              <th scope="row" className="px-2 py-1 text-left font-bold">
                {labels[i]}
              </th>
              {row.map((v, j) => (
                <td key={labels[j]} className="num px-2 py-1 whitespace-nowrap">
                  {formatWithUncertainty(v, sigma?.[part][i]?.[j]).text}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
