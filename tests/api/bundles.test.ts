import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { writeTomographyCsv } from "@shared/formats/tomographyCsv";
import { SessionBundleSchema, type SessionBundle } from "@shared/schemas/bundle";
import { ImportedBundleSchema } from "@shared/schemas/exports";
import { RunDetailSchema, type RunDetailDto } from "@shared/schemas/runs";
import { Attachment, AuditEntry, LabSession, Reconstruction, Run, RunRevision } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { psiMinusRows } from "../support/notebook";
import { PRIVATE_NOTE, expectNoLeak, sharingLab, type SharingFixture } from "../support/sharingFixture";
import { startTestApp, type TestApp } from "../support/testApp";

/**
 * Session bundles: export a whole session, import it into another lab (new ids, one
 * transaction) and get identical runs and reconstructions back — raw counts of every revision,
 * ρ, metrics, σ, parameters and uploaded files equal. Bad bundles are refused field by field
 * and leave nothing behind.
 */
describe("session bundles", () => {
  let t: TestApp;
  let s: SharingFixture;
  let target: LabFixture;
  let original: SessionBundle;
  let originalText: string;
  beforeAll(async () => {
    t = await startTestApp();
    s = await sharingLab(t);
    target = await labWithRoles(t);
    const lab = s.lab;
    // Give the session what a real one has: a corrected run, an extra reconstruction, an uploaded file.
    const rows = s.runB.rows.map((r, i) => (i === 3 ? { ...r, counts: r.counts + 7 } : r));
    await s.f.clients.member.post(`/api/labs/${lab}/runs/${s.runB.id}/revisions`, { reason: "HV misread", rows, reconstruction: { monteCarloSamples: 20 } }).expect(201);
    await s.f.clients.member.post(`/api/labs/${lab}/runs/${s.runA.id}/reconstructions`, { method: "mle", corrections: { accidentals: true }, monteCarloSamples: 20, seed: 99 }).expect(201);
    await s.f.clients.member.post(`/api/labs/${lab}/sessions/${s.sessionId}/runs/upload`).attach("file", Buffer.from(writeTomographyCsv(psiMinusRows({ seed: 5, singles: false }).map((r) => ({ setting: r.setting, counts: r.counts })))), { filename: "uploaded.csv", contentType: "text/csv" }).expect(201);
    const res = await s.f.clients.viewer.get(`/api/labs/${lab}/sessions/${s.sessionId}/bundle`).expect(200);
    originalText = res.text;
    original = SessionBundleSchema.parse(JSON.parse(res.text));
  });
  afterAll(() => t.close());

  const importInto = (f: LabFixture, text: string, client = f.clients.member) => client.post(`/api/labs/${f.lab.id}/bundles`).attach("bundle", Buffer.from(text), { filename: "session.rhomb.json", contentType: "application/json" });
  const stored = async () => ({
    sessions: await t.dataSource.getRepository(LabSession).count(),
    runs: await t.dataSource.getRepository(Run).count(),
    revisions: await t.dataSource.getRepository(RunRevision).count(),
    reconstructions: await t.dataSource.getRepository(Reconstruction).count(),
    attachments: await t.dataSource.getRepository(Attachment).count(),
  });
  const withoutExportTime = (b: SessionBundle) => ({ ...b, exportedAt: "" });
  const broken = (change: (b: SessionBundle) => void) => {
    const copy = structuredClone(original);
    change(copy);
    return JSON.stringify(copy);
  };

  it("exports the whole session: every run, revision, reconstruction and file, and no one's e-mail or private notes", () => {
    expect(original.session).toMatchObject({ title: "Shared session", notes: "", notesPrivate: true, coincidenceWindowNs: 3 });
    expect(original.runs.map((r) => r.name)).toEqual(["Shared run 5 mW", "Sibling run 10 mW", "uploaded"]);
    expect(original.runs[1].revisions.map((r) => [r.number, r.reason])).toEqual([[1, ""], [2, "HV misread"]]);
    expect(original.runs[0].reconstructions.map((r) => r.method)).toEqual(expect.arrayContaining(["linear", "mle", "mle"]));
    expect(original.runs[2].attachments).toHaveLength(1);
    // The session's list of people is part of its record in a bundle (not of a share).
    const keep = s.labSecrets.filter((x) => !x.startsWith("Student"));
    expect(original.session.people).toEqual(["Student at the table"]);
    expectNoLeak(originalText, [...keep, PRIVATE_NOTE]);
    expect(originalText).not.toMatch(/"(id|email|createdBy|labId|userId|sourceId|runId)":/);
  });

  it("puts private notes in only when asked", async () => {
    const res = await s.f.clients.member.get(`/api/labs/${s.lab}/sessions/${s.sessionId}/bundle?includePrivateNotes=true`).expect(200);
    expect(JSON.parse(res.text).session.notes).toBe(PRIVATE_NOTE);
  });

  it("imports into another lab with new ids, and the round trip is exact", async () => {
    const res = await importInto(target, originalText).expect(201);
    const imported = ImportedBundleSchema.parse(res.body);
    expect(imported).toMatchObject({ runs: 3, revisions: 4, reconstructions: original.runs.reduce((n, r) => n + r.reconstructions.length, 0), attachments: 1, source: { created: true } });
    // Exporting the imported session gives the same bundle (apart from the export time).
    const again = await target.clients.viewer.get(`/api/labs/${target.lab.id}/sessions/${imported.session.id}/bundle`).expect(200);
    expect(withoutExportTime(SessionBundleSchema.parse(JSON.parse(again.text)))).toEqual(withoutExportTime(original));

    // And run by run through the notebook API: identical counts, ρ, metrics and σ under new ids.
    const list = await target.clients.viewer.get(`/api/labs/${target.lab.id}/runs?sessionId=${imported.session.id}&sort=createdAt&order=asc`).expect(200);
    const copies: RunDetailDto[] = [];
    for (const r of list.body.data) copies.push(RunDetailSchema.parse((await target.clients.viewer.get(`/api/labs/${target.lab.id}/runs/${r.id}`).expect(200)).body));
    const originals: RunDetailDto[] = [];
    for (const r of (await s.f.clients.viewer.get(`/api/labs/${s.lab}/runs?sessionId=${s.sessionId}&sort=createdAt&order=asc`).expect(200)).body.data) {
      originals.push(RunDetailSchema.parse((await s.f.clients.viewer.get(`/api/labs/${s.lab}/runs/${r.id}`).expect(200)).body));
    }
    expect(copies.map((r) => r.name)).toEqual(originals.map((r) => r.name));
    copies.forEach((copy, i) => {
      const from = originals[i];
      expect(copy.id).not.toBe(from.id);
      expect(copy.rows).toEqual(from.rows);
      expect(copy.revisions.map((v) => [v.number, v.reason, v.rows])).toEqual(from.revisions.map((v) => [v.number, v.reason, v.rows]));
      const results = (d: RunDetailDto) => d.reconstructions.map((c) => ({ revision: c.revisionNumber, method: c.method, corrections: c.corrections, rho: c.rho, metrics: c.metrics, uncertainties: c.uncertainties, eigenvalues: c.eigenvalues, fit: c.fit, warnings: c.warnings }));
      expect(results(copy)).toEqual(results(from));
      expect(copy.headline).toEqual({ ...from.headline, reconstructionId: copy.headline?.reconstructionId });
      expect(copy.attachments.map((a) => [a.fileName, a.sha256, a.sizeBytes])).toEqual(from.attachments.map((a) => [a.fileName, a.sha256, a.sizeBytes]));
    });
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ labId: target.lab.id, action: "bundle.import" });
    expect(audit).toMatchObject({ actorId: target.users.member.id, entityId: imported.session.id });
  });

  it("reuses the lab's source of the same name, or the source chosen", async () => {
    const again = ImportedBundleSchema.parse((await importInto(target, originalText).expect(201)).body);
    expect(again.source.created).toBe(false);
    const chosen = await target.clients.member.post(`/api/labs/${target.lab.id}/sources`, { name: "Another crystal" }).expect(201);
    const res = await target.clients.member.post(`/api/labs/${target.lab.id}/bundles`).field("sourceId", chosen.body.id).attach("bundle", Buffer.from(originalText), "b.rhomb.json").expect(201);
    expect(res.body.source).toEqual({ id: chosen.body.id, name: "Another crystal", created: false });
    const elsewhere = await target.clients.member.post(`/api/labs/${target.lab.id}/bundles`).field("sourceId", s.runA.source.id).attach("bundle", Buffer.from(originalText), "b.rhomb.json").expect(400);
    expect(elsewhere.body.error.details[0].field).toBe("sourceId");
  });

  it("accepts the bundle as JSON too (for scripts)", async () => {
    const res = await target.clients.member.post(`/api/labs/${target.lab.id}/bundles`, { bundle: JSON.parse(originalText) }).expect(201);
    expect(res.body.runs).toBe(3);
  });

  it("refuses bad bundles naming every field, and stores nothing", async () => {
    const before = await stored();
    const cases: Array<[string, string, string | RegExp]> = [
      ["not JSON", "{ this is not json", "bundle"],
      ["another format", broken((b) => ((b as { format: string }).format = "something-else")), "format"],
      ["a negative count", broken((b) => (b.runs[0].revisions[0].rows[3].counts = -4)), "runs.0.revisions.0.rows.3.counts"],
      ["revisions out of order", broken((b) => (b.runs[1].revisions[1].number = 5)), "runs.1.revisions.1.number"],
      ["a reconstruction of a missing revision", broken((b) => (b.runs[0].reconstructions[0].revisionNumber = 4)), "runs.0.reconstructions.0.revisionNumber"],
      ["ρ of the wrong size", broken((b) => b.runs[0].reconstructions[0].rho.re.pop()), "runs.0.reconstructions.0.rho"],
      ["a NUL character in a name", broken((b) => (b.runs[0].name = "5 mW\u0000")), "runs.0.name"],
      ["a setting twice in a 16-setting run", broken((b) => (b.runs[0].revisions[0].rows[1].setting = b.runs[0].revisions[0].rows[0].setting)), "runs.0.revisions.0.rows.1.setting"],
    ];
    for (const [what, text, field] of cases) {
      const res = await importInto(target, text);
      expect(res.status, what).toBe(400);
      expect(res.body.error.details.map((d: { field: string }) => d.field), what).toContain(field);
      expect(res.body.error.message, what).toMatch(/Nothing was imported\.$/);
    }
    expect(await stored()).toEqual(before);
  });

  it("rolls back runs already written when a later file turns out damaged", async () => {
    const before = await stored();
    const text = broken((b) => (b.runs[2].attachments[0].contentBase64 = Buffer.from("tampered bytes!!").toString("base64")));
    const res = await importInto(target, text).expect(400);
    expect(res.body.error.details[0].field).toBe("runs.2.attachments.0.sizeBytes");
    const sameSize = broken((b) => {
      const a = b.runs[2].attachments[0];
      const bytes = Buffer.from(a.contentBase64, "base64");
      bytes[0] ^= 1;
      a.contentBase64 = bytes.toString("base64");
    });
    const res2 = await importInto(target, sameSize).expect(400);
    expect(res2.body.error.details[0].field).toBe("runs.2.attachments.0.sha256");
    expect(await stored()).toEqual(before);
  });

  it("viewers cannot import; outsiders cannot export", async () => {
    await importInto(target, originalText, target.clients.viewer).expect(403);
    await s.f.clients.outsider.get(`/api/labs/${s.f.otherLab.id}/sessions/${s.sessionId}/bundle`).expect(404);
    const none = await target.clients.member.post(`/api/labs/${target.lab.id}/bundles`).field("comment", "forgot the file").expect(400);
    expect(none.body.error.details).toEqual([{ field: "bundle", message: expect.stringMatching(/^Attach the bundle file/) }]);
  });
});
