import { formatDecimal } from "@shared/format/uncertainty";
import { basisLabels, describeElement, PART_NAME, type ComplexMatrix, type Part } from "./densityModel";
import { signColour } from "./palette";

const CELL = 56;
const HEAD = 34;

/**
 * The flat view: one cell per element with a bar rising from the cell's middle line for
 * positive values and falling for negative ones, coloured by sign; on the shared scale.
 * Also the fallback when the browser has no WebGL.
 */
export function DensityBars2D({ rho, sigma, scale, stacked = false }: { rho: ComplexMatrix; sigma?: ComplexMatrix | null; scale: number; stacked?: boolean }) {
  return (
    <div className={`grid gap-4 ${stacked ? "" : "md:grid-cols-2"}`}>
      {(["re", "im"] as const).map((part) => (
        <PartGrid key={part} part={part} rho={rho} sigma={sigma} scale={scale} />
      ))}
    </div>
  );
}

function PartGrid({ part, rho, sigma, scale }: { part: Part; rho: ComplexMatrix; sigma?: ComplexMatrix | null; scale: number }) {
  const labels = basisLabels(rho.re.length);
  const d = labels.length;
  const size = HEAD + d * CELL;
  return (
    <figure className="m-0">
      <figcaption className="mb-1 flex items-baseline justify-between text-sm">
        <span className="font-bold text-ink">{PART_NAME[part]} ρ</span>
        <span className="text-ink-faint">scale ±{scale}</span>
      </figcaption>
      <svg viewBox={`0 0 ${size} ${size}`} className="w-full max-w-sm" role="img" aria-label={`${PART_NAME[part]} ρ as flat bars; the table view lists every value.`}>
        {labels.map((l, j) => (
          <text key={`c${l}`} x={HEAD + j * CELL + CELL / 2} y={HEAD - 12} textAnchor="middle" className="fill-ink text-[12px] font-bold">
            {l}
          </text>
        ))}
        {labels.map((l, i) => (
          <text key={`r${l}`} x={HEAD - 6} y={HEAD + i * CELL + CELL / 2 + 4} textAnchor="end" className="fill-ink text-[12px] font-bold">
            {l}
          </text>
        ))}
        {rho[part].map((row, i) =>
          row.map((v, j) => {
            const x = HEAD + j * CELL;
            const y = HEAD + i * CELL;
            const half = CELL / 2 - 6;
            const h = (Math.min(Math.abs(v), scale) / scale) * half;
            return (
              <g key={`${i}-${j}`}>
                <title>{describeElement(rho, sigma, { part, row: i, col: j })}</title>
                <rect x={x + 1} y={y + 1} width={CELL - 2} height={CELL - 2} className="fill-paper stroke-paper-sunk" />
                <line x1={x + 6} x2={x + CELL - 6} y1={y + CELL / 2} y2={y + CELL / 2} className="stroke-ink-faint" strokeWidth={1} />
                <rect x={x + CELL / 2 - 9} y={v < 0 ? y + CELL / 2 : y + CELL / 2 - h} width={18} height={Math.max(h, 0.5)} fill={signColour(v)} />
                <text x={x + CELL - 4} y={v < 0 ? y + 12 : y + CELL - 4} textAnchor="end" className="fill-ink-soft text-[9px] tabular-nums">
                  {formatDecimal(v, 2)}
                </text>
              </g>
            );
          }),
        )}
      </svg>
    </figure>
  );
}
