import { fringeModelRate } from "@shared/physics/fringe";
import type { FringeAnalysisDto, FringeScanResultDto } from "@shared/schemas/fringe";
import { formatWithUncertainty } from "@shared/format/uncertainty";
import { type Column, DataTable } from "../../components/DataTable";
import { Panel } from "../../components/Panel";
import { ValueWithError } from "../../components/ValueWithError";
import { ChartFrame } from "../../plots/charts/ChartFrame";
import { FringeChart, type FringeSeries } from "../../plots/charts/FringeChart";

export const BASIS_LABEL = { HV: "H/V basis", DA: "D/A basis", other: "Other settings" } as const;

const CURVE_STEP_DEG = 1;

function scanLabel(s: FringeScanResultDto): string {
  const fixedArm = s.scannedArm === "A" ? "B" : "A";
  const letter = s.basis === "HV" ? (Math.round(s.fixedAngleDeg) % 180 === 0 ? " (H)" : " (V)") : s.basis === "DA" ? (Math.round(s.fixedAngleDeg) % 180 === 45 ? " (D)" : " (A)") : "";
  return `Arm ${fixedArm} at ${Math.round(s.fixedAngleDeg * 100) / 100}°${letter}`;
}

export function seriesOf(scans: FringeScanResultDto[]): FringeSeries[] {
  return scans.map((s) => ({
    label: scanLabel(s),
    points: s.points.map((p) => ({ angleDeg: p.angleDeg, rate: p.counts / p.seconds, sigma: Math.sqrt(p.counts) / p.seconds })),
    curve: Array.from({ length: 180 / CURVE_STEP_DEG + 1 }, (_, i) => ({ angleDeg: i * CURVE_STEP_DEG, rate: fringeModelRate(s.fit, i * CURVE_STEP_DEG) })),
  }));
}

/** Per-basis visibilities, the fitted parameters of every scan, and the plot of data and fits. */
export function FringeResults({ analysis }: { analysis: FringeAnalysisDto }) {
  const columns: Column<FringeScanResultDto>[] = [
    { key: "scan", header: "Scan", render: (s) => <span className="font-bold">{scanLabel(s)}</span> },
    { key: "basis", header: "Basis", render: (s) => BASIS_LABEL[s.basis] },
    { key: "rows", header: "Rows", numeric: true, render: (s) => s.rows.length },
    { key: "v", header: "V (fit) ± σ", numeric: true, render: (s) => <ValueWithError value={s.fit.visibility} uncertainty={s.fit.sigmaVisibility} /> },
    { key: "vraw", header: "V (extremes) ± σ", numeric: true, render: (s) => <ValueWithError value={s.extremes.visibility} uncertainty={s.extremes.sigma} /> },
    { key: "phase", header: "θ₀ ± σ", numeric: true, render: (s) => <ValueWithError value={s.fit.phaseDeg} uncertainty={s.fit.sigmaPhaseDeg} unit="°" /> },
    { key: "c0", header: "C₀ ± σ", numeric: true, render: (s) => <ValueWithError value={s.fit.c0} uncertainty={s.fit.sigmaC0} unit="/s" /> },
    { key: "bg", header: "Background", numeric: true, render: (s) => <ValueWithError value={s.fit.backgroundRate} significant={3} unit="/s" /> },
    { key: "chi", header: "χ² / dof", numeric: true, render: (s) => (s.fit.degreesOfFreedom > 0 ? `${formatWithUncertainty(s.fit.chiSquare, null, { significant: 3 }).text} / ${s.fit.degreesOfFreedom}` : "— (exact fit)") },
  ];
  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {analysis.byBasis.map((b) => (
          <Panel key={b.basis} title={`Visibility, ${BASIS_LABEL[b.basis]}`}>
            <p className="text-3xl font-bold tabular-nums">
              <ValueWithError value={b.visibility} uncertainty={b.sigma} />
            </p>
            <p className="mt-1 text-sm text-ink-soft">{b.scans === 1 ? "From one scan (fit)." : `Weighted mean of ${b.scans} scans (fit).`}</p>
          </Panel>
        ))}
      </div>
      <ChartFrame
        title="Fringes"
        fileName={`${analysis.runName} fringes`}
        height={360}
        caption={`Coincidence rate against the scanned analyser angle, ±1σ Poisson error bars; lines: C(θ) = C₀[1 + V cos 2(θ − θ₀)] + background, fitted by Poisson maximum likelihood.`}
      >
        <FringeChart series={seriesOf(analysis.scans)} />
      </ChartFrame>
      <DataTable caption="Fitted parameters per scan" columns={columns} rows={analysis.scans} rowKey={(s) => String(s.fixedAngleDeg)} />
    </div>
  );
}
