import { expect } from "vitest";
import { RunDetailSchema, type RunDetailDto } from "@shared/schemas/runs";
import { labWithRoles, type LabFixture } from "./clients";
import { psiMinusRows, sessionIn } from "./notebook";
import type { TestApp } from "./testApp";

export const PRIVATE_NOTE = "PRIVATE-NOTE: beam dump near the door is loose";
export const PERSON = "Student at the table";

export interface SharingFixture {
  f: LabFixture;
  lab: string;
  sessionId: string;
  otherSessionId: string;
  /** Two runs in the session, one run in another session of the same lab. */
  runA: RunDetailDto;
  runB: RunDetailDto;
  runC: RunDetailDto;
  /** Strings that must never appear outside the lab: e-mails, ids, private notes, people. */
  labSecrets: string[];
}

export async function postRun(f: LabFixture, sessionId: string, name: string, seed: number): Promise<RunDetailDto> {
  const res = await f.clients.member.post(`/api/labs/${f.lab.id}/sessions/${sessionId}/runs`, { settingSetId: "tomo16", name, notes: `notes of ${name}`, rows: psiMinusRows({ seed }), reconstruction: { monteCarloSamples: 30 } });
  if (res.status !== 201) throw new Error(`run ${name}: ${res.status} ${JSON.stringify(res.body)}`);
  return RunDetailSchema.parse(res.body);
}

/** A lab with a private-noted session of two runs and a second session with one run. */
export async function sharingLab(t: TestApp): Promise<SharingFixture> {
  const f = await labWithRoles(t);
  const { sessionId, sourceId } = await sessionIn(f, { title: "Shared session", notes: PRIVATE_NOTE, notesPrivate: true, people: [PERSON] });
  const other = await f.clients.member.post(`/api/labs/${f.lab.id}/sessions`, { sourceId, title: "Unshared session", date: "2026-03-03" }).expect(201);
  const runA = await postRun(f, sessionId, "Shared run 5 mW", 11);
  const runB = await postRun(f, sessionId, "Sibling run 10 mW", 12);
  const runC = await postRun(f, other.body.id, "Run of another session", 13);
  const users = Object.values(f.users);
  return {
    f,
    lab: f.lab.id,
    sessionId,
    otherSessionId: other.body.id,
    runA,
    runB,
    runC,
    labSecrets: [f.lab.id, PRIVATE_NOTE, PERSON, ...users.map((u) => u.email), ...users.map((u) => u.id), other.body.id, "Unshared session", runC.id, runC.name],
  };
}

/** Keys that name people or the lab's internals; none may appear in what leaves the lab. */
const FORBIDDEN_KEYS = ["email", "createdBy", "revokedBy", "people", "labId", "userId", "notesPrivate", "can", "attachments", "tokenSha256", "passwordHash"];

function keysOf(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => keysOf(v, out));
  else if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      keysOf(v, out);
    }
  }
  return out;
}

/** Asserts that `body` (JSON or text) contains none of `secrets` and, if JSON, none of the forbidden keys. */
export function expectNoLeak(body: unknown, secrets: string[]): void {
  const text = typeof body === "string" ? body : JSON.stringify(body);
  for (const s of secrets) expect(text, `leaks ${s}`).not.toContain(s);
  if (typeof body !== "string") {
    const keys = keysOf(body);
    for (const k of FORBIDDEN_KEYS) expect(keys.has(k), `has a "${k}" key`).toBe(false);
  }
}
