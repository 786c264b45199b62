/** The readable (non-JSON) output of `rhomb reconstruct`. */
import Complex from "complex.js";
import type { FiguresOfMerit, MonteCarloResult, Reconstruction } from "@shared/physics";

export function formatReport(file: string, r: Reconstruction, m: FiguresOfMerit, mc: MonteCarloResult | null): string {
  const out: string[] = [];
  const counts = r.corrections.windowNs === undefined ? `${r.totalCounts} counts` : `${r.totalCounts.toFixed(1)} counts after subtraction`;
  out.push(`${file}: ${r.method} reconstruction, ${r.photons} photon(s), ${counts}, handedness ${r.conventions.handedness}`);
  if (r.corrections.windowNs !== undefined) out.push(`accidentals subtracted with a ${r.corrections.windowNs} ns window; ${r.clippedRows} row(s) clipped`);
  out.push("", `ρ (rows and columns ${r.conventions.basisOrder.join(", ")}):`);
  const labels = r.conventions.basisOrder;
  r.rho.re.forEach((row, i) => {
    // complex.js formats each entry as a + bi.
    const cells = row.map((re, j) => new Complex(round(re), round(r.rho.im[i][j])).toString().padStart(20));
    out.push(`  ${labels[i].padEnd(4)}${cells.join("  ")}`);
  });
  out.push("", `eigenvalues: ${r.eigenvalues.map((x) => x.toFixed(5)).join("  ")}${r.physical ? "" : "   ← not physical"}`);
  const std = mc?.std;
  const line = (name: string, value: number | null, err?: number | null) =>
    out.push(`  ${name.padEnd(28)}${value === null ? "—" : value.toFixed(5)}${err ? `  ± ${err.toFixed(5)}` : ""}`);
  out.push("", `figures of merit${m.physical ? "" : " (of a non-physical estimate)"}:`);
  line(`fidelity to ${m.target ?? "—"}`, m.fidelity, std?.fidelity);
  if (m.phaseOptimised) {
    line(`phase-optimised fidelity`, m.phaseOptimised.fidelity, std?.phaseOptimisedFidelity);
    out.push(`  ${"  at phase φ".padEnd(28)}${((m.phaseOptimised.phase * 180) / Math.PI).toFixed(2)}° (${m.phaseOptimised.family})`);
  }
  line("concurrence", m.concurrence, std?.concurrence);
  line("tangle", m.tangle, std?.tangle);
  line("purity", m.purity, std?.purity);
  line("linear entropy", m.linearEntropy, std?.linearEntropy);
  line("von Neumann entropy, bits", m.vonNeumannEntropy, std?.vonNeumannEntropy);
  line("negativity", m.negativity, std?.negativity);
  line("CHSH maximum", m.chshMax, std?.chshMax);
  if (r.logLikelihood !== null) out.push(`  ${"log-likelihood".padEnd(28)}${r.logLikelihood.toFixed(6)}`);
  if (r.iterations !== null) {
    out.push(`  ${"iterations".padEnd(28)}${r.iterations} (${r.converged ? "converged" : "NOT converged"}; optimality gap ${r.optimalityGap?.toExponential(1)} nats)`);
  }
  if (mc) out.push("", `uncertainties: standard deviations of ${mc.samples} Monte Carlo samples, seed ${mc.seed}`);
  for (const w of r.warnings) out.push(`warning: ${w}`);
  return `${out.join("\n")}\n`;
}

function round(x: number): number {
  return Math.round(x * 1e5) / 1e5;
}
