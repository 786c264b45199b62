/**
 * rhomb upload --session ID [--url URL] [--token TOKEN] [--no-wait] FILE…
 *
 * Sends run files (one-run CSV or JSON, sweep CSV, or zips of them) as one batch into a lab
 * session with a personal API token, then follows the batch until every file is stored, failed
 * or recognised as a duplicate, printing one line per file. An acquisition script can call it
 * after each run:  rhomb upload --session "$SESSION" run-0042.csv
 *
 * --url and --token fall back to RHOMB_URL and RHOMB_TOKEN, --session to RHOMB_SESSION.
 * Exit code: 0 all stored (or already stored), 2 usage errors or files that failed, 1 anything
 * else (server unreachable, token refused, …).
 */
import { readFileSync, statSync } from "node:fs";
import { basename } from "node:path";
import { parseArgs } from "node:util";
import { LIMITS } from "@shared/limits";
import { CurrentCredentialsSchema } from "@shared/schemas/apiTokens";
import { BatchSchema, type BatchFileDto } from "@shared/schemas/batches";
import { CliInputError } from "./tomographyInput";

const POLL_MS = 1000;

class ServerError extends Error {}

export async function run(args: string[]): Promise<number> {
  try {
    const { values, positionals } = parseArgs({
      args,
      allowPositionals: true,
      options: { url: { type: "string" }, token: { type: "string" }, session: { type: "string" }, "no-wait": { type: "boolean", default: false } },
    });
    const url = (values.url ?? process.env.RHOMB_URL ?? "").replace(/\/+$/, "");
    const token = values.token ?? process.env.RHOMB_TOKEN ?? "";
    const session = values.session ?? process.env.RHOMB_SESSION ?? "";
    if (!url) throw new CliInputError("give the server with --url or RHOMB_URL, e.g. http://127.0.0.1:5180");
    if (!token) throw new CliInputError("give a personal API token with --token or RHOMB_TOKEN (create one on the API tokens page)");
    if (!/^[0-9a-f-]{36}$/i.test(session)) throw new CliInputError("give the lab session's id with --session or RHOMB_SESSION (shown on the session's batch upload page)");
    if (positionals.length === 0) throw new CliInputError("name at least one file to upload");

    const api = client(url, token);
    const who = CurrentCredentialsSchema.parse(await api("GET", "/api/tokens/current"));
    if (!who.token) throw new ServerError("the server did not recognise the token as an API token");
    const form = readFiles(positionals);
    const accepted = BatchSchema.parse(await api("POST", `/api/labs/${who.token.lab.id}/sessions/${session}/batches`, form));
    process.stdout.write(`batch ${accepted.id}: ${accepted.fileCount} file(s) into lab “${who.token.lab.name}”\n`);
    // Follow the batch, printing each file once as it finishes.
    const printed = new Set<string>();
    let batch = accepted;
    printNew(batch.files, printed);
    while (!values["no-wait"] && !batch.done) {
      await new Promise((r) => setTimeout(r, POLL_MS));
      batch = BatchSchema.parse(await api("GET", `/api/labs/${batch.labId}/batches/${batch.id}`));
      printNew(batch.files, printed);
    }
    const c = batch.counts;
    process.stdout.write(`${c.stored} stored, ${c.duplicate} already stored, ${c.failed} failed${batch.done ? "" : `, ${c.queued + c.processing} still queued`}\n`);
    return c.failed > 0 ? 2 : 0;
  } catch (error) {
    const usage = error instanceof CliInputError || (error instanceof TypeError && (error as { code?: string }).code?.startsWith("ERR_PARSE_ARGS"));
    process.stderr.write(`rhomb upload: ${(error as Error).message}\n`);
    return usage ? 2 : 1;
  }
}

type Api = (method: "GET" | "POST", path: string, body?: FormData) => Promise<unknown>;

function client(url: string, token: string): Api {
  return async (method, path, body) => {
    let res: Response;
    try {
      res = await fetch(`${url}${path}`, { method, headers: { Authorization: `Bearer ${token}`, Accept: "application/json" }, body });
    } catch (e) {
      throw new ServerError(`cannot reach ${url} (${(e as Error & { cause?: Error }).cause?.message ?? (e as Error).message})`);
    }
    const data = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    if (!res.ok) throw new ServerError(`${res.status}: ${data?.error?.message ?? res.statusText}`);
    return data;
  };
}

function readFiles(paths: string[]): FormData {
  const form = new FormData();
  let total = 0;
  for (const path of paths) {
    let size: number;
    try {
      size = statSync(path).size;
    } catch {
      throw new CliInputError(`cannot read ${path}`);
    }
    total += size;
    if (total > LIMITS.batchUploadBytes) throw new CliInputError(`the files add up to more than ${LIMITS.batchUploadBytes / 1_000_000} MB, the most one batch takes; upload them in several calls`);
    form.append("files", new Blob([readFileSync(path)]), basename(path));
  }
  return form;
}

function printNew(files: BatchFileDto[], printed: Set<string>): void {
  for (const f of files) {
    if (printed.has(f.id) || f.status === "queued" || f.status === "processing") continue;
    printed.add(f.id);
    const line =
      f.status === "stored" ? `stored     ${f.fileName} → run “${f.run?.name ?? "?"}”${f.message ? ` (${f.message})` : ""}` : f.status === "duplicate" ? `duplicate  ${f.message}` : `failed     ${f.message}`;
    process.stdout.write(`${line}\n`);
  }
}
