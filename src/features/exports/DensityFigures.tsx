import { useRef, useState } from "react";
import { Button } from "../../components/Button";
import { DensityBars2D } from "../../plots/DensityBars2D";
import { downloadChartPng, downloadChartSvg, fileStemOf } from "../../plots/charts/exportChart";
import { PART_NAME, sharedScale, type ComplexMatrix, type Part } from "../../plots/densityModel";

/**
 * Re ρ and Im ρ as figures to save (SVG, or PNG at twice the screen size), drawn as the flat
 * bars on their shared scale. Saving goes through the charts' export helper; each part's
 * <figure> holds exactly one <svg>, so the helper picks that one.
 */
export function DensityFigures({ rho, sigma, name }: { rho: ComplexMatrix; sigma?: ComplexMatrix | null; name: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const [error, setError] = useState<string | null>(null);
  const save = async (part: Part, kind: "svg" | "png") => {
    setError(null);
    const figure = ref.current?.querySelectorAll("figure")[part === "re" ? 0 : 1] as HTMLElement | undefined;
    if (!figure) return setError("The figure is not drawn yet.");
    const stem = fileStemOf(`${name} ${PART_NAME[part]} rho`);
    try {
      if (kind === "svg") downloadChartSvg(figure, stem);
      else await downloadChartPng(figure, stem);
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
