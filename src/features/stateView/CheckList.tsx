import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import { Alert } from "../../components/Alert";

/** Things the reader should know before trusting the numbers: the engine's warnings, fit status. */
export function CheckList({ reconstruction }: { reconstruction: ReconstructionDto }) {
  const items = [...reconstruction.warnings.map((w) => w.message)];
  const { fit, counts } = reconstruction;
  if (fit.converged === false) items.push("The maximum-likelihood fit did not converge; its numbers may be off.");
  if (counts.clippedRows.length && !reconstruction.warnings.some((w) => w.code.includes("clip"))) {
    items.push(`Accidental subtraction clipped ${counts.clippedRows.length} row(s) to zero (rows ${counts.clippedRows.map((r) => r + 1).join(", ")}).`);
  }
  if (items.length === 0) return <p className="text-sm text-success">Nothing to flag: the fit converged and the counts raised no warnings.</p>;
  return (
    <Alert kind="caution" title={`${items.length} thing${items.length > 1 ? "s" : ""} to check`}>
      <ul className="list-disc space-y-1 pl-5 text-sm">
        {[...new Set(items)].map((m) => (
          <li key={m}>{m}</li>
        ))}
      </ul>
    </Alert>
  );
}
