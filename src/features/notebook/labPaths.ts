/** The notebook's addresses, built in one place. */
export const labPaths = {
  home: (labId: string) => `/labs/${labId}`,
  sources: (labId: string) => `/labs/${labId}/sources`,
  newSession: (labId: string, sourceId?: string) => `/labs/${labId}/sessions/new${sourceId ? `?sourceId=${sourceId}` : ""}`,
  session: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}`,
  newRun: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}/runs/new`,
  newBellTest: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}/bell-test/new`,
  newFringeScan: (labId: string, sessionId: string) => `/labs/${labId}/sessions/${sessionId}/fringe-scan/new`,
  batchUpload: (labId: string, sessionId?: string) => `/labs/${labId}/batches${sessionId ? `?session=${sessionId}` : ""}`,
  run: (labId: string, runId: string) => `/labs/${labId}/runs/${runId}`,
  bellTest: (labId: string, runId: string) => `/labs/${labId}/runs/${runId}/bell-test`,
  fringeFit: (labId: string, runId: string) => `/labs/${labId}/runs/${runId}/fringe-fit`,
  trends: (labId: string, scope?: { sessionId?: string; sourceId?: string }) =>
    `/labs/${labId}/trends${scope?.sessionId ? `?sessionId=${scope.sessionId}` : scope?.sourceId ? `?sourceId=${scope.sourceId}` : ""}`,
  compare: (labId: string, runIds: string[] = []) => `/labs/${labId}/compare${runIds.length ? `?runs=${runIds.join(",")}` : ""}`,
};
