import type { ShareItemType } from "@shared/schemas/shares";

/** Where the lab's export files and reports are, built in one place. */
export const exportPaths = {
  counts: (labId: string, runId: string) => `/api/labs/${labId}/runs/${runId}/counts.csv`,
  reconstruction: (labId: string, reconstructionId: string, file: "rho.csv" | "rho.json" | "metrics.csv" | "metrics.json") => `/api/labs/${labId}/reconstructions/${reconstructionId}/export/${file}`,
  sessionMetrics: (labId: string, sessionId: string, file: "metrics.csv" | "metrics.json") => `/api/labs/${labId}/sessions/${sessionId}/export/${file}`,
  bundle: (labId: string, sessionId: string, includePrivateNotes = false) => `/api/labs/${labId}/sessions/${sessionId}/bundle${includePrivateNotes ? "?includePrivateNotes=true" : ""}`,
  /** The printable report page (a client route). */
  report: (labId: string, itemType: ShareItemType, itemId: string) => `/labs/${labId}/reports/${itemType}/${itemId}`,
  importBundle: (labId: string) => `/labs/${labId}/import`,
  shares: (labId: string) => `/labs/${labId}/shares`,
};
