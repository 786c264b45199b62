import { expect } from "vitest";
import { RUN_JSON_FORMAT } from "@shared/formats/runJson";
import { BatchSchema, type BatchDto } from "@shared/schemas/batches";
import type { CountsRowInput } from "@shared/schemas/runs";
import type { TestClient } from "./clients";

export interface UploadFile {
  name: string;
  content: string | Buffer;
}

/** POSTs files as one batch (multipart, field "files") into a session. */
export function uploadBatch(client: TestClient, labId: string, sessionId: string, files: UploadFile[]) {
  let req = client.post(`/api/labs/${labId}/sessions/${sessionId}/batches`);
  for (const f of files) req = req.attach("files", Buffer.isBuffer(f.content) ? f.content : Buffer.from(f.content, "utf8"), f.name);
  return req;
}

/** Polls the batch until every file is finished (stored, failed or duplicate). */
export async function waitForBatch(client: TestClient, labId: string, batchId: string, timeoutMs = 60_000): Promise<BatchDto> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await client.get(`/api/labs/${labId}/batches/${batchId}`).expect(200);
    const batch = BatchSchema.parse(res.body);
    if (batch.done) return batch;
    if (Date.now() > until) throw new Error(`batch not done after ${timeoutMs} ms: ${JSON.stringify(batch.counts)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** A one-run JSON file; Monte Carlo off unless asked, to keep tests quick. */
export function runJson(name: string, rows: CountsRowInput[], extra: Record<string, unknown> = {}): string {
  return JSON.stringify({ format: RUN_JSON_FORMAT, name, settingSetId: "tomo16", rows, reconstruction: { monteCarloSamples: 0 }, ...extra });
}

export function fileNamed(batch: BatchDto, name: string) {
  const f = batch.files.find((x) => x.fileName === name);
  expect(f, `no file "${name}" in ${batch.files.map((x) => x.fileName).join(", ")}`).toBeDefined();
  return f!;
}
