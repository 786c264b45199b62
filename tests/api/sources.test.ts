import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SourcePageSchema, SourceSchema } from "@shared/schemas/sources";
import { AuditEntry } from "../../server/entities/index";
import { labWithRoles, type LabFixture } from "../support/clients";
import { startTestApp, type TestApp } from "../support/testApp";

describe("sources", () => {
  let t: TestApp;
  let f: LabFixture;
  let base: string;
  beforeAll(async () => {
    t = await startTestApp();
    f = await labWithRoles(t);
    base = `/api/labs/${f.lab.id}/sources`;
  });
  afterAll(() => t.close());

  it("creates a source with defaults, returns the caller's allowed actions, and audits the write", async () => {
    const res = await f.clients.member.post(base, { name: "Sagnac-T", crystal: "ppKTP type-II", pumpLaser: "405 nm CW diode", wavelengthNm: 810 }).expect(201);
    const source = SourceSchema.parse(res.body);
    expect(source).toMatchObject({ name: "Sagnac-T", targetState: "psi-", notes: "", sessionCount: 0, can: { read: true, write: true, manage: false } });
    expect(source.createdBy?.displayName).toBe(f.users.member.displayName);
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ entityId: source.id });
    expect(audit).toMatchObject({ action: "source.create", actorId: f.users.member.id, labId: f.lab.id });
  });

  it("names each bad field", async () => {
    const res = await f.clients.member.post(base, { name: " ", wavelengthNm: -3, targetState: "bell" }).expect(400);
    expect(res.body.error.code).toBe("invalid");
    const fields = res.body.error.details.map((d: { field: string }) => d.field).sort();
    expect(fields).toEqual(["name", "targetState", "wavelengthNm"]);
    expect(res.body.error.details.find((d: { field: string }) => d.field === "wavelengthNm").message).toBe("Wavelength must be above 0 nm.");
  });

  it("refuses a second source with the same name (any case) in the lab", async () => {
    await f.clients.member.post(base, { name: "Twin" }).expect(201);
    const res = await f.clients.member.post(base, { name: "TWIN" }).expect(409);
    expect(res.body.error.details).toEqual([{ field: "name", message: "A source with this name exists in this lab." }]);
  });

  it("edits a source and records what changed", async () => {
    const created = await f.clients.owner.post(base, { name: "Editable" }).expect(201);
    const res = await f.clients.member.patch(`${base}/${created.body.id}`, { notes: "Realigned the loop", targetState: "phi+" }).expect(200);
    expect(res.body).toMatchObject({ notes: "Realigned the loop", targetState: "phi+" });
    const audit = await t.dataSource.getRepository(AuditEntry).findOneByOrFail({ entityId: created.body.id, action: "source.update" });
    expect(audit.changes).toEqual({ notes: { from: "", to: "Realigned the loop" }, targetState: { from: "psi-", to: "phi+" } });
    await f.clients.member.patch(`${base}/${created.body.id}`, {}).expect(400);
  });

  it("lets viewers read but not write, and hides the lab from outsiders", async () => {
    const created = await f.clients.owner.post(base, { name: "Guarded" }).expect(201);
    await f.clients.viewer.get(`${base}/${created.body.id}`).expect(200);
    const denied = await f.clients.viewer.post(base, { name: "Nope" }).expect(403);
    expect(denied.body.error.code).toBe("forbidden");
    await f.clients.viewer.patch(`${base}/${created.body.id}`, { notes: "x" }).expect(403);
    await f.clients.outsider.get(`${base}/${created.body.id}`).expect(404);
    await f.clients.outsider.get(base).expect(404);
    await f.clients.anonymous.get(base).expect(401);
  });

  it("answers 404 for a source id of another lab, even to a member", async () => {
    const other = await f.clients.outsider.get("/api/labs").expect(200);
    const otherLabId = other.body.data[0].id;
    const foreign = await f.clients.outsider.post(`/api/labs/${otherLabId}/sources`, { name: "Elsewhere" }).expect(201);
    await f.clients.member.get(`${base}/${foreign.body.id}`).expect(404);
    await f.clients.member.patch(`${base}/${foreign.body.id}`, { notes: "x" }).expect(404);
  });

  it("pages, sorts and searches", async () => {
    for (const name of ["Alpha crystal", "beta crystal", "Gamma loop"]) await f.clients.member.post(base, { name, crystal: name.includes("loop") ? "BBO" : "ppKTP" }).expect(201);
    const all = SourcePageSchema.parse((await f.clients.viewer.get(`${base}?sort=name&order=asc&pageSize=100`).expect(200)).body);
    const names = all.data.map((s) => s.name);
    expect(names).toEqual([...names].sort((a, b) => a.toLowerCase().localeCompare(b.toLowerCase())));
    const page2 = SourcePageSchema.parse((await f.clients.viewer.get(`${base}?sort=name&order=asc&pageSize=2&page=2`).expect(200)).body);
    expect(page2.page).toEqual({ number: 2, size: 2, total: all.page.total });
    expect(page2.data.map((s) => s.name)).toEqual(names.slice(2, 4));
    const found = SourcePageSchema.parse((await f.clients.viewer.get(`${base}?q=CRYSTAL`).expect(200)).body);
    expect(found.data.map((s) => s.name).sort()).toEqual(["Alpha crystal", "beta crystal"]);
    const literal = SourcePageSchema.parse((await f.clients.viewer.get(`${base}?q=%25`).expect(200)).body);
    expect(literal.data).toEqual([]);
    const bad = await f.clients.viewer.get(`${base}?sort=colour&pageSize=1000`).expect(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(["pageSize", "sort"]);
  });
});
