/**
 * Re ρ and Im ρ as two 3D bar charts on one vertical scale, with linked cameras. Loaded with a
 * dynamic import (three + fiber are ~300 kB gzip), so pages without a state view never pay.
 */
import { useMemo, useState } from "react";
import { Canvas } from "@react-three/fiber";
import { BarScene } from "./BarScene";
import { basisLabels, describeElement, PART_NAME, stepElement, type ComplexMatrix, type Part } from "./densityModel";
import { createViewLink, type ViewLink } from "./viewLink";

export interface DensityBars3DProps {
  rho: ComplexMatrix;
  sigma?: ComplexMatrix | null;
  scale: number;
}

const TURN = Math.PI / 12;

export default function DensityBars3D({ rho, sigma, scale }: DensityBars3DProps) {
  const link = useMemo(() => createViewLink(), []);
  const labels = basisLabels(rho.re.length);
  return (
    <div>
      <div className="grid gap-4 md:grid-cols-2">
        {(["re", "im"] as const).map((part) => (
          <PartChart key={part} part={part} rho={rho} sigma={sigma} scale={scale} labels={labels} link={link} />
        ))}
      </div>
      <ViewToolbar link={link} />
    </div>
  );
}

function PartChart({ part, rho, sigma, scale, labels, link }: { part: Part; rho: ComplexMatrix; sigma?: ComplexMatrix | null; scale: number; labels: string[]; link: ViewLink }) {
  const [hovered, setHovered] = useState<{ row: number; col: number } | null>(null);
  const [focused, setFocused] = useState<{ row: number; col: number } | null>(null);
  const active = hovered ?? focused;
  const readoutId = `bars3d-${part}-readout`;
  const helpId = `bars3d-help`;

  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.shiftKey && (e.key === "ArrowLeft" || e.key === "ArrowRight")) link.turn(e.key === "ArrowLeft" ? -TURN : TURN);
    else if (e.shiftKey && (e.key === "ArrowUp" || e.key === "ArrowDown")) link.tilt(e.key === "ArrowUp" ? -TURN / 2 : TURN / 2);
    else if (e.key === "+" || e.key === "=") link.zoom(1.15);
    else if (e.key === "-") link.zoom(1 / 1.15);
    else if (e.key === "0") link.reset();
    else if (e.key === "Escape") setFocused(null);
    else {
      const next = stepElement(focused ?? { row: 0, col: 0 }, e.key, labels.length);
      if (!next) return;
      setFocused(focused ? next : { row: 0, col: 0 });
    }
    e.preventDefault();
  };

  return (
    <figure className="m-0">
      <figcaption className="mb-1 flex items-baseline justify-between text-sm">
        <span className="font-bold text-ink">{PART_NAME[part]} ρ</span>
        <span className="text-ink-faint">scale ±{scale}</span>
      </figcaption>
      <div
        tabIndex={0}
        role="application"
        aria-roledescription="3D bar chart"
        aria-label={`${PART_NAME[part]} ρ, ${labels.length} by ${labels.length} elements`}
        aria-describedby={`${readoutId} ${helpId}`}
        data-testid={`bars3d-${part}`}
        onKeyDown={onKeyDown}
        onFocus={(e) => {
          // Only keyboard focus picks an element; a click to start a drag should not.
          if (e.currentTarget.matches(":focus-visible")) setFocused((f) => f ?? { row: 0, col: 0 });
        }}
        onBlur={() => setFocused(null)}
        className="relative h-80 cursor-grab overflow-hidden rounded-md border border-paper-sunk bg-paper-raised active:cursor-grabbing"
      >
        <Canvas
          frameloop="demand"
          dpr={[1, 2]}
          camera={{ fov: 36, near: 0.1, far: 100 }}
          gl={{ preserveDrawingBuffer: true, antialias: true }}
          fallback={<p className="p-4 text-sm text-ink-soft">This browser cannot draw 3D graphics; use the flat view or the table.</p>}
        >
          <BarScene values={rho[part]} labels={labels} scale={scale} active={active} onHover={setHovered} link={link} linkId={part} />
        </Canvas>
      </div>
      <p id={readoutId} aria-live="polite" className="num mt-1 min-h-6 text-left text-sm text-ink">
        {active ? describeElement(rho, sigma, { part, ...active }) : <span className="text-ink-faint">Point at a bar, or focus the chart and use the arrow keys.</span>}
      </p>
    </figure>
  );
}

function ViewToolbar({ link }: { link: ViewLink }) {
  const button = "rounded-md border border-paper-sunk bg-paper-raised px-2.5 py-1 text-sm font-bold text-ink-soft hover:bg-paper-sunk hover:text-ink";
  return (
    <div className="mt-2 flex flex-wrap items-center gap-2" role="toolbar" aria-label="3D view">
      <button type="button" className={button} onClick={() => link.turn(-TURN)} aria-label="Turn left">
        ⟲ Turn
      </button>
      <button type="button" className={button} onClick={() => link.turn(TURN)} aria-label="Turn right">
        Turn ⟳
      </button>
      <button type="button" className={button} onClick={() => link.zoom(1.15)}>
        Zoom in
      </button>
      <button type="button" className={button} onClick={() => link.zoom(1 / 1.15)}>
        Zoom out
      </button>
      <button type="button" className={button} onClick={() => link.reset()}>
        Reset view
      </button>
      <p id="bars3d-help" className="text-xs text-ink-faint">
        Drag to turn, scroll to zoom. Focused chart: arrows pick an element, Shift + arrows turn, + and − zoom, 0 resets.
      </p>
    </div>
  );
}
