import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import { FIDELITY_KEY } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import { ValueWithError } from "../../components/ValueWithError";
import { BELL_SYMBOL } from "./meritRows";

/** The four numbers people look for first, large; the scorecard below has all of them. */
export function KeyFigures({ reconstruction: r, target }: { reconstruction: ReconstructionDto; target: BellTarget }) {
  const s = r.uncertainties?.metrics;
  const items = [
    { key: FIDELITY_KEY[target], label: `Fidelity to ${BELL_SYMBOL[target]}` },
    { key: "concurrence", label: "Concurrence" },
    { key: "purity", label: "Purity" },
    { key: "chshMax", label: "Largest CHSH value" },
  ] as const;
  return (
    <dl className="grid grid-cols-2 gap-3 md:grid-cols-4" data-testid="key-figures">
      {items.map((i) => (
        <div key={i.key} className="rounded-md border border-paper-sunk bg-paper-raised px-4 py-3">
          <dt className="text-sm text-ink-soft">{i.label}</dt>
          <dd className="mt-0.5 text-2xl font-bold text-ink">
            <ValueWithError value={r.metrics[i.key]} uncertainty={s?.[i.key]} />
          </dd>
        </div>
      ))}
    </dl>
  );
}
