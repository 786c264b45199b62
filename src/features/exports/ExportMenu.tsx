import { Link } from "react-router-dom";
import type { ShareItemType } from "@shared/schemas/shares";
import { buttonClass } from "../../components/Button";
import { fileLinkClass } from "./FileLink";
import { ITEM_SHORT } from "../sharing/shareWords";
import { exportPaths } from "./exportPaths";

interface ExportLink {
  label: string;
  href: string;
  /** A client page (the report) rather than a file. */
  page?: boolean;
}

function linksFor(labId: string, itemType: ShareItemType, itemId: string): ExportLink[] {
  const report = { label: "Printable report", href: exportPaths.report(labId, itemType, itemId), page: true };
  if (itemType === "run") return [report, { label: "Raw counts (CSV)", href: exportPaths.counts(labId, itemId) }];
  if (itemType === "reconstruction") {
    return [
      report,
      { label: "ρ, real and imaginary parts (CSV)", href: exportPaths.reconstruction(labId, itemId, "rho.csv") },
      { label: "ρ with σ and eigenvalues (JSON)", href: exportPaths.reconstruction(labId, itemId, "rho.json") },
      { label: "Figures of merit (CSV)", href: exportPaths.reconstruction(labId, itemId, "metrics.csv") },
      { label: "Figures of merit (JSON)", href: exportPaths.reconstruction(labId, itemId, "metrics.json") },
    ];
  }
  return [
    report,
    { label: "Figures of merit of every run (CSV)", href: exportPaths.sessionMetrics(labId, itemId, "metrics.csv") },
    { label: "Figures of merit of every run (JSON)", href: exportPaths.sessionMetrics(labId, itemId, "metrics.json") },
    { label: "Whole session as a bundle (JSON, re-importable)", href: exportPaths.bundle(labId, itemId) },
    { label: "Bundle including private notes", href: exportPaths.bundle(labId, itemId, true) },
  ];
}

/**
 * The "Export" menu of a session, run or reconstruction: the printable report and the export
 * files (layouts in README "Sharing and exports"). A disclosure, so it works from the keyboard
 * and without script state.
 */
export function ExportMenu({ labId, itemType, itemId }: { labId: string; itemType: ShareItemType; itemId: string }) {
  return (
    <details className="relative">
      <summary className={`${buttonClass("secondary")} cursor-pointer list-none [&::-webkit-details-marker]:hidden`}>Export {ITEM_SHORT[itemType]} ▾</summary>
      <ul className="absolute right-0 z-20 mt-1 w-72 space-y-1 rounded-md border border-paper-sunk bg-paper-raised p-3 text-sm shadow-lg">
        {linksFor(labId, itemType, itemId).map((l) => (
          <li key={l.href}>
            {l.page ? (
              <Link className={fileLinkClass} to={l.href}>
                {l.label}
              </Link>
            ) : (
              <a className={fileLinkClass} href={l.href} download>
                {l.label}
              </a>
            )}
          </li>
        ))}
      </ul>
    </details>
  );
}
