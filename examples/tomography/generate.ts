/**
 * Regenerates the sample counts files of this folder: `npx tsx examples/tomography/generate.ts`.
 * Invented demo data (the "Sagnac-2" source of the demo scenario), drawn from known states with
 * Poisson noise and fixed seeds, so the files reproduce exactly.
 *
 * Source model (invented): ρ = p|ψ⟩⟨ψ| + (1 − p)·I/4 with ψ = (|HV⟩ − e^{iδ}|VH⟩)/√2,
 * p = 0.98, δ = 0.05 rad; detected pair rate 1500 /s per mW of pump; singles 20 000 /s per mW
 * in each arm; coincidence window 3 ns, so accidentals grow with the square of the pump power.
 */
import { writeFileSync } from "node:fs";
import { simulateCounts, standardSet, type DensityMatrix } from "../../shared/physics";
import { writeTomographyCsv } from "../../shared/formats/tomographyCsv";

const WINDOW_NS = 3;
const folder = new URL("./", import.meta.url);

function sourceState(p = 0.98, delta = 0.05): DensityMatrix {
  const s = Math.SQRT1_2;
  const psi = { re: [0, s, -s * Math.cos(delta), 0], im: [0, 0, -s * Math.sin(delta), 0] };
  const re: number[][] = [];
  const im: number[][] = [];
  for (let i = 0; i < 4; i++) {
    re.push([]);
    im.push([]);
    for (let j = 0; j < 4; j++) {
      // ψ_i conj(ψ_j)
      const r = psi.re[i] * psi.re[j] + psi.im[i] * psi.im[j];
      const m = psi.im[i] * psi.re[j] - psi.re[i] * psi.im[j];
      re[i].push(p * r + (i === j ? (1 - p) / 4 : 0));
      im[i].push(p * m + 0);
    }
  }
  return { re, im };
}

function write(name: string, setId: "tomo16" | "tomo36", pumpMw: number, seconds: number, seed: number, description: string): void {
  const rows = simulateCounts({
    rho: sourceState(),
    settings: standardSet(setId).labels,
    pairRate: 1500 * pumpMw,
    seconds,
    seed,
    singles: { rateA: 20_000 * pumpMw, rateB: 20_000 * pumpMw, windowNs: WINDOW_NS },
  });
  const comments = [
    "Invented demo data for Rhomb (not a measurement): Sagnac-2 source, simulated with Poisson noise.",
    `${description}; pump ${pumpMw} mW; coincidence window ${WINDOW_NS} ns; seed ${seed}.`,
    "basis: photon A's analyser letter first. singles_a/singles_b: singles counts during the exposure.",
  ];
  writeFileSync(new URL(name, folder), writeTomographyCsv(rows, comments));
}

write("sagnac2-1mW-tomo16.csv", "tomo16", 1, 5, 101, "16-setting tomography (James et al. 2001 order)");
write("sagnac2-5mW-tomo16.csv", "tomo16", 5, 2, 105, "16-setting tomography (James et al. 2001 order)");
write("sagnac2-20mW-tomo16.csv", "tomo16", 20, 1, 120, "16-setting tomography at high pump power: many accidentals, try --window-ns 3");
write("sagnac2-5mW-tomo36.csv", "tomo36", 5, 2, 205, "36-setting overcomplete tomography");
