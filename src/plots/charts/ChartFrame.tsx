import { useRef, useState } from "react";
import { Button } from "../../components/Button";
import { downloadChartPng, downloadChartSvg, fileStemOf } from "./exportChart";

/**
 * Every 2D chart sits in one of these: a title, the chart, a caption saying what is drawn,
 * and "Save PNG" / "Save SVG" buttons that save exactly what is on screen.
 */
export function ChartFrame({ title, caption, fileName, children, height = 320 }: { title: string; caption?: React.ReactNode; fileName?: string; children: React.ReactNode; height?: number }) {
  const ref = useRef<HTMLDivElement>(null);
  const [error, setError] = useState<string | null>(null);
  const stem = fileStemOf(fileName ?? title);
  const save = async (kind: "png" | "svg") => {
    setError(null);
    try {
      if (!ref.current) return;
      if (kind === "svg") downloadChartSvg(ref.current, stem);
      else await downloadChartPng(ref.current, stem);
    } catch (e) {
      setError((e as Error).message);
    }
  };
  return (
    <figure className="rounded-lg border border-paper-sunk bg-paper-raised p-4 shadow-sm">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-bold text-ink">{title}</h3>
        <div className="flex gap-1.5">
          <Button variant="secondary" size="sm" onClick={() => save("png")} aria-label={`Save PNG of “${title}”`}>
            Save PNG
          </Button>
          <Button variant="secondary" size="sm" onClick={() => save("svg")} aria-label={`Save SVG of “${title}”`}>
            Save SVG
          </Button>
        </div>
      </div>
      <div ref={ref} style={{ height }} className="w-full">
        {children}
      </div>
      {caption && <figcaption className="mt-2 text-sm text-ink-soft">{caption}</figcaption>}
      {error && (
        <p role="alert" className="mt-2 text-sm font-bold text-danger">
          {error}
        </p>
      )}
    </figure>
  );
}
