/**
 * Trend data: every run of one session, one source or the whole lab with all its figures and x-values, so
 * the client can plot any figure against any parameter. Figures come from stored
 * reconstructions (tomography runs) or are computed from the raw counts (|S| of Bell runs at
 * the default angles, fitted visibilities of fringe runs without background).
 */
import { In } from "typeorm";
import { accidentalRate, analyseBellRun, pairRate } from "@shared/physics/bell";
import { EngineInputError } from "@shared/physics/errors";
import { analyseFringeRun } from "@shared/physics/fringe";
import { FIDELITY_KEY, METRIC_KEYS } from "@shared/schemas/reconstructions";
import type { TrendDto, TrendFigureKey, TrendQuery, TrendRunDto } from "@shared/schemas/trends";
import { TREND_FIGURE_KEYS } from "@shared/schemas/trends";
import type { BellTarget } from "@shared/schemas/sources";
import { db } from "../db/dataSource";
import { Lab } from "../entities/Lab";
import { LabSession } from "../entities/LabSession";
import { Reconstruction } from "../entities/Reconstruction";
import { Run } from "../entities/Run";
import { RunRevision } from "../entities/RunRevision";
import { Source } from "../entities/Source";
import { notFound } from "../http/errors";
import { engineRows } from "./runRows";

export async function trendOf(labId: string, query: TrendQuery): Promise<TrendDto> {
  const em = db().manager;
  const { scope, sessions } = await scopeOf(labId, query);
  const sessionById = new Map(sessions.map((s) => [s.id, s]));
  const sessionOrder = new Map(sessions.map((s, i) => [s.id, i]));
  // Sessions by date, then each session's runs in recording order.
  const runs = (sessions.length ? await em.find(Run, { where: { labId, sessionId: In([...sessionById.keys()]) }, order: { createdAt: "ASC", id: "ASC" } }) : []).sort(
    (a, b) => sessionOrder.get(a.sessionId)! - sessionOrder.get(b.sessionId)!,
  );
  const revisions = await currentRevisions(runs);
  const reconstructions = await chosenReconstructions(runs, revisions, query);
  const trendRuns = runs.map((run, order) => {
    const session = sessionById.get(run.sessionId)!;
    const rows = engineRows(revisions.get(run.id)!.rows, null);
    const notes: string[] = [];
    const rec = reconstructions.get(run.id) ?? null;
    if (run.kind === "tomography" && !rec) notes.push(`No ${query.method} reconstruction of the current counts.`);
    else if (rec && rec.corrections.accidentals !== query.accidentals) {
      notes.push(`Only a reconstruction ${rec.corrections.accidentals ? "with" : "without"} accidental subtraction exists; it is shown.`);
    }
    const dto: TrendRunDto = {
      runId: run.id,
      name: run.name,
      kind: run.kind,
      sessionId: session.id,
      sessionTitle: session.title,
      x: {
        pumpPowerMw: run.conditions.pumpPowerMw ?? session.pumpPowerMw,
        crystalTemperatureC: run.conditions.crystalTemperatureC ?? session.crystalTemperatureC,
        compensatorTiltDeg: run.conditions.compensatorTiltDeg ?? null,
        exposureSeconds: rows.reduce((s, r) => s + (r.seconds ?? 1), 0) / rows.length,
        recordedAt: run.createdAt.getTime(),
        order: order + 1,
      },
      figures: figuresOf(run, rows, rec, scope.targetState ?? session.source!.targetState, notes),
      pairRate: pairRate(rows),
      accidentalRate: accidentalRate(rows, session.coincidenceWindowNs),
      reconstructionId: rec?.id ?? null,
      notes,
    };
    return dto;
  });
  return { scope: { kind: scope.kind, id: scope.id, title: scope.title, targetState: scope.targetState }, method: query.method, accidentals: query.accidentals, runs: trendRuns };
}

type Figures = TrendRunDto["figures"];

function figuresOf(run: Run, rows: ReturnType<typeof engineRows>, rec: Reconstruction | null, target: BellTarget, notes: string[]): Figures {
  const figures = Object.fromEntries(TREND_FIGURE_KEYS.map((k) => [k, null])) as Figures;
  if (rec) {
    for (const k of METRIC_KEYS) {
      const value = rec.metrics[k];
      if (value !== null) figures[k] = { value, sigma: rec.uncertainties?.metrics[k] ?? null };
    }
    figures.fidelityTarget = figures[FIDELITY_KEY[target] as TrendFigureKey];
  }
  try {
    if (run.kind === "bell") {
      const r = analyseBellRun(rows);
      figures.chshAbsS = { value: Math.abs(r.s), sigma: r.sigmaS };
    } else if (run.kind === "fringe") {
      for (const b of analyseFringeRun(rows).byBasis) {
        if (b.basis === "other") continue;
        figures[b.basis === "HV" ? "visibilityHV" : "visibilityDA"] = { value: b.visibility, sigma: Number.isFinite(b.sigma) ? b.sigma : null };
      }
    }
  } catch (e) {
    if (!(e instanceof EngineInputError)) throw e;
    notes.push(`The ${run.kind} analysis failed: ${e.message}`);
  }
  return figures;
}

interface Scope {
  kind: "session" | "source" | "lab";
  id: string;
  title: string;
  /** Null for a whole lab: fidelityTarget then uses each run's own source. */
  targetState: BellTarget | null;
}

async function scopeOf(labId: string, query: TrendQuery): Promise<{ scope: Scope; sessions: LabSession[] }> {
  const em = db().manager;
  if (query.sessionId) {
    const session = await em.findOne(LabSession, { where: { id: query.sessionId, labId }, relations: { source: true } });
    if (!session) throw notFound("Session");
    return { scope: { kind: "session", id: session.id, title: session.title, targetState: session.source!.targetState }, sessions: [session] };
  }
  if (query.sourceId) {
    const source = await em.findOne(Source, { where: { id: query.sourceId, labId } });
    if (!source) throw notFound("Source");
    const sessions = await em.find(LabSession, { where: { labId, sourceId: source.id }, relations: { source: true }, order: { date: "ASC", createdAt: "ASC" } });
    return { scope: { kind: "source", id: source.id, title: source.name, targetState: source.targetState }, sessions };
  }
  const lab = await em.findOneByOrFail(Lab, { id: labId });
  const sessions = await em.find(LabSession, { where: { labId }, relations: { source: true }, order: { date: "ASC", createdAt: "ASC" } });
  return { scope: { kind: "lab", id: lab.id, title: lab.name, targetState: null }, sessions };
}

async function currentRevisions(runs: Run[]): Promise<Map<string, RunRevision>> {
  if (!runs.length) return new Map();
  const revisions = await db()
    .manager.createQueryBuilder(RunRevision, "rev")
    .innerJoin(Run, "run", "run.id = rev.run_id AND run.current_revision = rev.number")
    .where("rev.run_id IN (:...ids)", { ids: runs.map((r) => r.id) })
    .getMany();
  return new Map(revisions.map((r) => [r.runId, r]));
}

/** Per tomography run: the newest reconstruction of the method for the current counts, preferring the asked accidental setting. */
async function chosenReconstructions(runs: Run[], revisions: Map<string, RunRevision>, query: TrendQuery): Promise<Map<string, Reconstruction>> {
  const revisionIds = runs.filter((r) => r.kind === "tomography").map((r) => revisions.get(r.id)!.id);
  if (!revisionIds.length) return new Map();
  const all = await db().manager.find(Reconstruction, { where: { revisionId: In(revisionIds), method: query.method }, order: { createdAt: "DESC", id: "ASC" } });
  const chosen = new Map<string, Reconstruction>();
  for (const r of all) {
    const current = chosen.get(r.runId);
    const prefer = (x: Reconstruction) => x.corrections.accidentals === query.accidentals;
    if (!current || (!prefer(current) && prefer(r))) chosen.set(r.runId, r);
  }
  return chosen;
}
