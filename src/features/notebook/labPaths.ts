/** The notebook's addresses, built in one place. */
export const labPaths = {
  home: (labId: string) => `/labs/${labId}`,
  sources: (labId: string) => `/labs/${labId}/sources`,
  newSession: (labId: string, sourceId?: string) => `/labs/${labId}/sessions/new${sourceId ? `?sourceId=${sourceId}` : ""}`,
  session: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}`,
  newRun: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}/runs/new`,
  run: (labId: string, runId: string) => `/labs/${labId}/runs/${runId}`,
  compare: (labId: string, runIds: string[] = []) => `/labs/${labId}/compare${runIds.length ? `?runs=${runIds.join(",")}` : ""}`,
};
