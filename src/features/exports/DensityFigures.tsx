import { useRef, useState } from "react";
import { Button } from "../../components/Button";
import { DensityBars2D } from "../../plots/DensityBars2D";
import { downloadChartPng, downloadChartSvg, fileStemOf } from "../../plots/charts/exportChart";
import { PART_NAME, sharedScale, type ComplexMatrix, type Part } from "../../plots/densityModel";

/**
 * Re ρ and Im ρ as figures to save (SVG, or PNG at twice the screen size), drawn as the flat
 * bars on their shared scale. Saving goes through the charts' export helper, which carries over
 * text styles only (its charts paint shapes with attributes); the flat bars paint cells with CSS
 * classes, so a copy with every fill and stroke written out is handed to it instead.
 */
export function DensityFigures({ rho, sigma, name }: { rho: ComplexMatrix; sigma?: ComplexMatrix | null; name: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const [error, setError] = useState<string | null>(null);
  const save = async (part: Part, kind: "svg" | "png") => {
    setError(null);
    const svg = ref.current?.querySelectorAll("figure")[part === "re" ? 0 : 1]?.querySelector("svg");
    if (!svg) return setError("The figure is not drawn yet.");
    const stem = fileStemOf(`${name} ${PART_NAME[part]} rho`);
    try {
      await withPaintWrittenOut(svg, (holder) => (kind === "svg" ? downloadChartSvg(holder, stem) : downloadChartPng(holder, stem)));
    } catch (e) {
      setError((e as Error).message);
    }
  };
  return (
    <div>
      <div ref={ref}>
        <DensityBars2D rho={rho} sigma={sigma} scale={sharedScale(rho)} />
      </div>
      <div className="mt-2 flex flex-wrap gap-2 print:hidden">
        {(["re", "im"] as const).map((part) =>
          (["png", "svg"] as const).map((kind) => (
            <Button key={part + kind} variant="secondary" size="sm" onClick={() => save(part, kind)}>
              Save {PART_NAME[part]} ρ as {kind.toUpperCase()}
            </Button>
          )),
        )}
      </div>
      {error && (
        <p role="alert" className="mt-2 text-sm font-bold text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

/** Runs `use` on an off-screen copy of `svg` whose fills and strokes are attributes, not CSS classes. */
async function withPaintWrittenOut(svg: SVGSVGElement, use: (holder: HTMLElement) => void | Promise<void>): Promise<void> {
  const { width } = svg.getBoundingClientRect();
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const from = [svg, ...svg.querySelectorAll("*")];
  const to = [copy, ...copy.querySelectorAll("*")];
  from.forEach((node, i) => {
    const style = getComputedStyle(node);
    if (!to[i].getAttribute("fill")) to[i].setAttribute("fill", style.fill);
    if (!to[i].getAttribute("stroke") && style.stroke !== "none") to[i].setAttribute("stroke", style.stroke);
  });
  const holder = document.createElement("div");
  holder.style.cssText = `position: fixed; left: -10000px; top: 0; width: ${width}px;`;
  holder.appendChild(copy);
  document.body.appendChild(holder);
  try {
    await use(holder);
  } finally {
    holder.remove();
  }
}
