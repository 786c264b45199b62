/** Query keys of every resource, in one place so invalidation matches what was fetched. */
export const queryKeys = {
  health: ["health"] as const,
  me: ["me"] as const,
  labs: ["labs"] as const,
  lab: (labId: string) => ["labs", labId] as const,
  members: (labId: string) => ["labs", labId, "members"] as const,
  invitations: (labId: string) => ["labs", labId, "invitations"] as const,
  invitation: (token: string) => ["invitation", token] as const,
  devOutbox: ["dev-outbox"] as const,
  /** Everything of the notebook (sources, sessions, runs, reconstructions); a write invalidates it all. */
  labNotebook: (labId: string) => ["labs", labId, "notebook"] as const,
  labHome: (labId: string) => ["labs", labId, "notebook", "home"] as const,
  sources: (labId: string, query: object) => ["labs", labId, "notebook", "sources", query] as const,
  source: (labId: string, sourceId: string) => ["labs", labId, "notebook", "source", sourceId] as const,
  labSessions: (labId: string, query: object) => ["labs", labId, "notebook", "sessions", query] as const,
  labSession: (labId: string, sessionId: string) => ["labs", labId, "notebook", "session", sessionId] as const,
  runs: (labId: string, query: object) => ["labs", labId, "notebook", "runs", query] as const,
  run: (labId: string, runId: string) => ["labs", labId, "notebook", "run", runId] as const,
  compare: (labId: string, runIds: string[], method: string) => ["labs", labId, "notebook", "compare", runIds, method] as const,
  /** Batch uploads: under the lab but not the notebook, so notebook writes do not refetch them. */
  batches: (labId: string, sessionId?: string) => ["labs", labId, "batches", ...(sessionId ? [sessionId] : [])] as const,
  batch: (labId: string, batchId: string) => ["labs", labId, "batch", batchId] as const,
  apiTokens: ["api-tokens"] as const,
};
