import type { BellTestDto } from "@shared/schemas/bell";
import { formatWithUncertainty } from "@shared/format/uncertainty";
import { Alert } from "../../components/Alert";
import { type Column, DataTable } from "../../components/DataTable";
import { Panel } from "../../components/Panel";
import { ValueWithError } from "../../components/ValueWithError";
import { ChartFrame } from "../../plots/charts/ChartFrame";
import { ChshScale } from "../../plots/charts/ChshScale";
import { CorrelationChart } from "../../plots/charts/CorrelationChart";

type Row = BellTestDto["correlations"][number];

const PAIR_LABEL: Record<Row["name"], string> = { "a,b": "E(a, b)", "a,b'": "E(a, b′)", "a',b": "E(a′, b)", "a',b'": "E(a′, b′)" };

const deg = (x: number) => `${Math.round(x * 1000) / 1000}°`;

/** Measured CHSH beside the prediction of the session's reconstructed ρ. */
export function BellResults({ test, runName }: { test: BellTestDto; runName: string }) {
  const p = test.prediction;
  const columns: Column<Row>[] = [
    { key: "pair", header: "Correlation", render: (r) => <span className="font-bold">{PAIR_LABEL[r.name]}</span> },
    { key: "angles", header: "Angles A, B", numeric: true, render: (r) => `${deg(r.alphaDeg)}, ${deg(r.betaDeg)}` },
    { key: "sign", header: "Sign in S", numeric: true, render: (r) => (r.sign > 0 ? "+" : "−") },
    { key: "counts", header: "Coincidences", numeric: true, render: (r) => r.totalCounts.toLocaleString("en-GB") },
    { key: "rows", header: "Rows", numeric: true, render: (r) => r.rows.map((i) => i + 1).join(", ") },
    { key: "e", header: "Measured E ± σ", numeric: true, render: (r) => <ValueWithError value={r.value} uncertainty={r.sigma} /> },
    { key: "pred", header: "Predicted by ρ", numeric: true, render: (r) => <ValueWithError value={r.predicted} significant={3} /> },
    { key: "diff", header: "(E − E_ρ) / σ_E", numeric: true, render: (r) => (r.predicted === null ? "—" : formatWithUncertainty((r.value - r.predicted) / r.sigma, null, { significant: 2 }).text) },
  ];
  const violated = test.significance !== null && test.significance > 0;
  return (
    <div className="space-y-4">
      <div className="grid gap-4 lg:grid-cols-3">
        <Panel title="Measured S">
          <p className="text-3xl font-bold tabular-nums text-ink">
            S = <ValueWithError value={test.s} uncertainty={test.sigmaS} />
          </p>
          <p className="mt-2 text-ink-soft">
            |S| − 2 in standard deviations:{" "}
            <strong className="tabular-nums text-ink">{test.significance === null ? "—" : formatWithUncertainty(test.significance, null, { significant: 3 }).text} σ</strong>
          </p>
          <p className={`mt-2 text-sm font-bold ${violated ? "text-success" : "text-caution"}`}>
            {violated ? "Above the local-realist bound |S| ≤ 2." : "Not above the local-realist bound |S| ≤ 2."}
          </p>
          <p className="mt-1 text-xs text-ink-faint">σ from Poisson statistics of the {test.totalCounts.toLocaleString("en-GB")} coincidences (first-order propagation).</p>
        </Panel>
        <Panel title="Predicted by the reconstructed state">
          {p ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1.5">
              <dt className="text-ink-soft">At these angles</dt>
              <dd className="text-right text-xl font-bold tabular-nums">
                <ValueWithError value={p.s} significant={3} />
              </dd>
              <dt className="text-ink-soft">At the best angles</dt>
              <dd className="text-right text-xl font-bold tabular-nums">
                <ValueWithError value={p.maximum} uncertainty={p.maximumSigma} />
              </dd>
              <dt className="text-ink-soft">From</dt>
              <dd className="text-right text-sm">
                {p.runName} ({p.method === "mle" ? "maximum likelihood" : p.method}){p.physical ? "" : " — not physical"}
              </dd>
            </dl>
          ) : (
            <p className="text-ink-soft">{test.predictionNote}</p>
          )}
          <p className="mt-2 text-xs text-ink-faint">Best angles: the Horodecki maximum 2√(m₁ + m₂) over all analysers (Phys. Lett. A 200, 340 (1995)).</p>
        </Panel>
        <Panel title="Angles used">
          <p className="tabular-nums">
            a = {deg(test.angles.aDeg)}, a′ = {deg(test.angles.aPrimeDeg)}, b = {deg(test.angles.bDeg)}, b′ = {deg(test.angles.bPrimeDeg)}
          </p>
          <p className="mt-1 text-sm text-ink-soft">
            {test.anglesOrigin === "standard" ? "The standard CHSH angles." : test.anglesOrigin === "given" ? "As entered below." : "Read off the rows (the standard angles were not measured)."} Polariser angles; a half-wave plate turns by half.
          </p>
          <p className="mt-1 text-xs text-ink-faint">Counts revision {test.revisionNumber}.</p>
        </Panel>
      </div>
      {p && Math.abs(Math.abs(test.s) - Math.abs(p.s)) > 3 * test.sigmaS && (
        <Alert kind="caution" title="Measurement and reconstruction disagree">
          |S| measured differs from the prediction of ρ by more than 3 σ_S. Check that both runs used the same alignment, and the angles.
        </Alert>
      )}
      <DataTable caption={`Correlations of ${runName}`} columns={columns} rows={test.correlations} rowKey={(r) => r.name} />
      <div className="grid gap-4 lg:grid-cols-2">
        <ChartFrame title="Correlations" fileName={`${runName} correlations`} caption="Measured E with ±1σ error bars (circles) and the prediction of ρ at the same angles (squares).">
          <CorrelationChart points={test.correlations.map((c) => ({ label: PAIR_LABEL[c.name], measured: c.value, sigma: c.sigma, predicted: c.predicted }))} />
        </ChartFrame>
        <ChartFrame title="|S| against the bounds" fileName={`${runName} chsh`} caption="Shaded: allowed by local realism (|S| ≤ 2). Dashed: the quantum bound 2√2. Error bars ±1σ." height={240}>
          <ChshScale
            marks={[
              { label: "Measured", value: Math.abs(test.s), sigma: test.sigmaS },
              ...(p ? [{ label: "ρ at these angles", value: Math.abs(p.s), sigma: 0 }, { label: "ρ at best angles", value: p.maximum, sigma: p.maximumSigma ?? 0 }] : []),
            ]}
          />
        </ChartFrame>
      </div>
    </div>
  );
}
