import { lazy, Suspense, useState } from "react";
import { Alert } from "../components/Alert";
import { ErrorBoundary } from "../components/ErrorBoundary";
import { SegmentedToggle } from "../components/SegmentedToggle";
import { DensityBars2D } from "./DensityBars2D";
import { DensityTable } from "./DensityTable";
import { sharedScale, type ComplexMatrix } from "./densityModel";
import { PALETTE } from "./palette";
import { hasWebGL } from "./webgl";

const DensityBars3D = lazy(() => import("./DensityBars3D"));

type ViewKind = "bars3d" | "flat" | "table";

/**
 * Every view of one density matrix: 3D bars (when the browser has WebGL), flat bars and the
 * table, all on one scale shared by Re ρ and Im ρ.
 */
export function DensityPlots({ rho, sigma, initialView = "bars3d" }: { rho: ComplexMatrix; sigma?: ComplexMatrix | null; initialView?: ViewKind }) {
  const webgl = hasWebGL();
  const [view, setView] = useState<ViewKind>(webgl ? initialView : initialView === "bars3d" ? "flat" : initialView);
  const scale = sharedScale(rho);
  const flat = <DensityBars2D rho={rho} sigma={sigma} scale={scale} />;
  return (
    <div>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
        <SegmentedToggle
          label="View"
          value={view}
          onChange={setView}
          options={[
            { value: "bars3d", label: "3D bars", disabled: !webgl },
            { value: "flat", label: "Flat bars" },
            { value: "table", label: "Table" },
          ]}
        />
        <SignLegend />
      </div>
      {!webgl && view !== "table" && (
        <div className="mb-3">
          <Alert kind="info" title="3D view unavailable">
            This browser cannot draw WebGL graphics, so the bars are shown flat. The numbers are the same.
          </Alert>
        </div>
      )}
      {view === "bars3d" && webgl && (
        <ErrorBoundary
          fallback={() => (
            <>
              <div className="mb-3">
                <Alert kind="caution" title="The 3D view failed to load">
                  Showing the flat bars instead; reload the page to try again.
                </Alert>
              </div>
              {flat}
            </>
          )}
        >
          <Suspense fallback={<p className="h-72 text-ink-faint" role="status">Loading the 3D view…</p>}>
            <DensityBars3D rho={rho} sigma={sigma} scale={scale} />
          </Suspense>
        </ErrorBoundary>
      )}
      {view === "flat" && flat}
      {view === "table" && <DensityTable rho={rho} sigma={sigma} />}
    </div>
  );
}

function SignLegend() {
  return (
    <p className="flex items-center gap-4 text-sm text-ink-soft">
      <span className="flex items-center gap-1.5">
        <span aria-hidden="true" className="inline-block h-3 w-3" style={{ background: PALETTE.positive }} />
        positive, bar up
      </span>
      <span className="flex items-center gap-1.5">
        <span aria-hidden="true" className="inline-block h-3 w-3" style={{ background: PALETTE.negative }} />
        negative, bar down
      </span>
    </p>
  );
}
