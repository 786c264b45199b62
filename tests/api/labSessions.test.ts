import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LabSessionPageSchema, LabSessionSchema } from "@shared/schemas/labSessions";
import { AuditEntry } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

describe("lab sessions", () => {
  let t: TestApp;
  let f: LabFixture;
  let base: string;
  let sourceId: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    base = `/api/labs/${f.lab.id}/sessions`;
    sourceId = (await f.clients.member.post(`/api/labs/${f.lab.id}/sources`, { name: "Loop source" }).expect(201)).body.id;
  });
  afterAll(() => t.close());

  const setup = (over: object = {}) => ({
    sourceId,
    title: "Pump power sweep",
    date: "2026-03-02",
    people: ["Student", "Postdoc"],
    pumpWavelengthNm: 405,
    pumpPowerMw: 5,
    crystalTemperatureC: 31.5,
    coincidenceWindowNs: 3,
    detectors: "Si APDs",
    calibration: [{ qwp: { fastAxisOffsetDeg: 0.8, retardanceErrorDeg: -2 }, hwp: {} }, {}],
    handedness: "R=H-iV",
    ...over,
  });

  it("stores the whole setup, filling in ideal plates and defaults", async () => {
    const res = await f.clients.member.post(base, setup()).expect(201);
    const s = LabSessionSchema.parse(res.body);
    expect(s).toMatchObject({ title: "Pump power sweep", date: "2026-03-02", handedness: "R=H-iV", source: { id: sourceId, name: "Loop source" }, runCount: 0, notesPrivate: false });
    expect(s.calibration).toEqual([
      { qwp: { fastAxisOffsetDeg: 0.8, retardanceErrorDeg: -2 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } },
      { qwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 }, hwp: { fastAxisOffsetDeg: 0, retardanceErrorDeg: 0 } },
    ]);
    expect(s.analyser).toEqual({ arms: [{ bothPorts: false }, { bothPorts: false }] });
    const again = await f.clients.viewer.get(`${base}/${s.id}`).expect(200);
    expect(again.body).toEqual({ ...res.body, can: { read: true, write: false, manage: false } });
  });

  it("names each bad field, down to the plate", async () => {
    const res = await f.clients.member.post(base, setup({ date: "2026-02-30", coincidenceWindowNs: 0, calibration: [{ qwp: { fastAxisOffsetDeg: 120 } }, {}], handedness: "left" })).expect(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field).sort();
    expect(fields).toEqual(["calibration.0.qwp.fastAxisOffsetDeg", "coincidenceWindowNs", "date", "handedness"]);
  });

  it("refuses a source of another lab as a field error", async () => {
    const otherLabId = (await f.clients.outsider.get("/api/labs").expect(200)).body.data[0].id;
    const foreign = (await f.clients.outsider.post(`/api/labs/${otherLabId}/sources`, { name: "Theirs" }).expect(201)).body.id;
    const res = await f.clients.member.post(base, setup({ sourceId: foreign })).expect(400);
    expect(res.body.error.details).toEqual([{ field: "sourceId", message: "No such source in this lab." }]);
  });

  it("edits the setup and audits the change; viewers and outsiders cannot", async () => {
    const s = (await f.clients.member.post(base, setup({ title: "To edit" })).expect(201)).body;
    const res = await f.clients.owner.patch(`${base}/${s.id}`, { pumpPowerMw: 10, notes: "HWP B re-zeroed" }).expect(200);
    expect(res.body).toMatchObject({ pumpPowerMw: 10, notes: "HWP B re-zeroed" });
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ entityId: s.id, action: "labSession.update" });
    expect(audit.changes).toEqual({ pumpPowerMw: { from: 5, to: 10 }, notes: { from: "", to: "HWP B re-zeroed" } });
    await f.clients.viewer.patch(`${base}/${s.id}`, { notes: "x" }).expect(403);
    await f.clients.outsider.patch(`${base}/${s.id}`, { notes: "x" }).expect(404);
    await f.clients.outsider.get(`${base}/${s.id}`).expect(404);
  });

  it("filters by source and date range, sorts by date, and searches people and notes", async () => {
    const other = (await f.clients.member.post(`/api/labs/${f.lab.id}/sources`, { name: "Second source" }).expect(201)).body.id;
    for (const [date, src, people] of [["2026-01-10", other, ["Visitor"]], ["2026-01-20", other, []], ["2026-04-01", other, []]] as const) {
      await f.clients.member.post(base, setup({ sourceId: src, date, people, title: `On ${date}` })).expect(201);
    }
    const bySource = LabSessionPageSchema.parse((await f.clients.viewer.get(`${base}?sourceId=${other}&sort=date&order=asc`).expect(200)).body);
    expect(bySource.data.map((s) => s.date)).toEqual(["2026-01-10", "2026-01-20", "2026-04-01"]);
    const ranged = LabSessionPageSchema.parse((await f.clients.viewer.get(`${base}?sourceId=${other}&from=2026-01-15&to=2026-03-31`).expect(200)).body);
    expect(ranged.data.map((s) => s.date)).toEqual(["2026-01-20"]);
    const byPerson = LabSessionPageSchema.parse((await f.clients.viewer.get(`${base}?q=visitor`).expect(200)).body);
    expect(byPerson.data.map((s) => s.title)).toEqual(["On 2026-01-10"]);
    const paged = LabSessionPageSchema.parse((await f.clients.viewer.get(`${base}?pageSize=2&sort=date&order=desc`).expect(200)).body);
    expect(paged.data).toHaveLength(2);
    expect(paged.data[0].date >= paged.data[1].date).toBe(true);
    expect(paged.page.total).toBeGreaterThanOrEqual(5);
  });
});
