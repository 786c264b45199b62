import type { ReconstructionDto } from "@shared/schemas/reconstructions";
import { FIDELITY_KEY } from "@shared/schemas/reconstructions";
import type { BellTarget } from "@shared/schemas/sources";
import { DataTable } from "../../components/DataTable";
import { ValueWithError } from "../../components/ValueWithError";
import { BELL_SYMBOL, METHOD_NAME } from "../stateView/meritRows";
import { describeCorrections } from "./reconstructionChoice";
import { formatDateTime } from "@shared/format/dates";

/** Every stored reconstruction of a run, newest first; choosing one shows it above. */
export function ReconstructionHistory({ reconstructions, selectedId, onSelect, target, currentRevision }: {
  reconstructions: ReconstructionDto[];
  selectedId: string;
  onSelect: (id: string) => void;
  target: BellTarget;
  currentRevision: number;
}) {
  const key = FIDELITY_KEY[target];
  return (
    <DataTable
      caption="Every reconstruction of this run"
      captionHidden
      rows={reconstructions}
      rowKey={(r) => r.id}
      columns={[
        {
          key: "show",
          header: "Shown",
          render: (r) =>
            r.id === selectedId ? (
              <span className="font-bold text-petrol-700">● shown</span>
            ) : (
              <button type="button" className="font-bold text-petrol-700 underline" onClick={() => onSelect(r.id)}>
                Show
              </button>
            ),
        },
        { key: "method", header: "Method", render: (r) => METHOD_NAME[r.method] },
        { key: "corrections", header: "Corrections", render: (r) => describeCorrections(r.corrections) },
        { key: "revision", header: "Counts", render: (r) => `revision ${r.revisionNumber}${r.revisionNumber === currentRevision ? "" : " (older)"}` },
        { key: "fidelity", header: `F(${BELL_SYMBOL[target]})`, numeric: true, render: (r) => <ValueWithError value={r.metrics[key]} uncertainty={r.uncertainties?.metrics[key]} /> },
        { key: "physical", header: "Physical", render: (r) => (r.physical ? "yes" : <strong className="text-danger">no</strong>) },
        { key: "when", header: "Computed", render: (r) => formatDateTime(r.createdAt) },
      ]}
    />
  );
}
