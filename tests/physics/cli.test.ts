/**
 * The `rhomb` command line as scripts use it: `npm run --silent rhomb -- …` (spawned for real).
 */
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("../..", import.meta.url));
const example = "examples/tomography/sagnac2-5mW-tomo16.csv";

function rhomb(...args: string[]) {
  const r = spawnSync("npm", ["run", "--silent", "rhomb", "--", ...args], { cwd: root, encoding: "utf8", timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe("rhomb reconstruct", () => {
  it("--json prints exactly one JSON object with the documented keys at full precision", () => {
    const r = rhomb("reconstruct", example, "--method", "mle", "--target", "psi-", "--json");
    expect(r.code).toBe(0);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const out = JSON.parse(r.stdout);
    expect(out.method).toBe("mle");
    expect(out.rho.re).toHaveLength(4);
    expect(out.rho.im.every((row: number[]) => row.length === 4)).toBe(true);
    for (const key of ["fidelity", "concurrence", "tangle", "purity", "linearEntropy", "vonNeumannEntropy", "negativity", "chshMax"]) {
      expect(typeof out.metrics[key]).toBe("number");
    }
    expect(typeof out.logLikelihood).toBe("number");
    expect(out.converged).toBe(true);
    // ρ is printed unrounded: a diagonal entry has more than 10 significant digits
    expect(String(out.rho.re[1][1]).replace(/^0\./, "").length).toBeGreaterThan(10);
    expect(out.metrics.fidelity).toBeGreaterThan(0.9);
  }, 60_000);

  it("linear inversion, the other handedness and accidental subtraction are options", () => {
    const plain = JSON.parse(rhomb("reconstruct", example, "--method", "linear", "--json").stdout);
    const flipped = JSON.parse(rhomb("reconstruct", example, "--method", "linear", "--handedness", "R=H-iV", "--json").stdout);
    expect(flipped.rho.im[1][2]).toBeCloseTo(-plain.rho.im[1][2], 12);
    const subtracted = JSON.parse(rhomb("reconstruct", "examples/tomography/sagnac2-20mW-tomo16.csv", "--method", "mle", "--target", "psi-", "--window-ns", "3", "--json").stdout);
    const raw = JSON.parse(rhomb("reconstruct", "examples/tomography/sagnac2-20mW-tomo16.csv", "--method", "mle", "--target", "psi-", "--json").stdout);
    expect(subtracted.corrections.windowNs).toBe(3);
    expect(subtracted.metrics.fidelity).toBeGreaterThan(raw.metrics.fidelity + 0.02);
  }, 120_000);

  it("bad input: exit code 2 and one line on stderr naming the row and column", () => {
    const dir = mkdtempSync(join(tmpdir(), "rhomb-cli-"));
    const bad = join(dir, "bad.csv");
    writeFileSync(bad, "# invented\nbasis,counts\nHH,10\nHV,12x\n");
    const r = rhomb("reconstruct", bad, "--method", "mle", "--json");
    expect(r.code).toBe(2);
    expect(r.stdout).toBe("");
    const lines = r.stderr.trim().split("\n");
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain('row 4, column "counts": "12x" is not a whole number ≥ 0');
  }, 60_000);

  it("without --json prints a readable table", () => {
    const r = rhomb("reconstruct", example, "--method", "mle", "--target", "psi-");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/fidelity to psi-\s+0\.9\d+/);
    expect(r.stdout).toMatch(/eigenvalues:/);
  }, 60_000);
});

describe("rhomb bench", () => {
  it("--json prints the median time of one MLE reconstruction and the log-likelihood", () => {
    const r = rhomb("bench", example, "--repeat", "20", "--json");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.msPerReconstruction).toBeGreaterThan(0);
    const reference = JSON.parse(rhomb("reconstruct", example, "--method", "mle", "--json").stdout);
    expect(out.logLikelihood).toBe(reference.logLikelihood);
  }, 120_000);
});
