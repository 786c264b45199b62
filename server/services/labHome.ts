import { db } from "../db/dataSource";
import { Source } from "../entities/Source";
import { listLabSessions, type LabSessionWithCount } from "./labSessions";
import { listRuns, type RunSummary } from "./runQueries";

export interface BestFidelity {
  source: Source;
  best: {
    fidelity: number;
    uncertainty: number | null;
    method: "linear" | "mle" | "projected";
    accidentalsSubtracted: boolean;
    reconstructionId: string;
    run: { id: string; name: string };
    session: { id: string; title: string; date: string };
  } | null;
}

export interface LabHome {
  totals: { sources: number; sessions: number; runs: number };
  recentSessions: LabSessionWithCount[];
  recentRuns: RunSummary[];
  bestBySource: BestFidelity[];
}

const RECENT_SESSIONS = 5;
const RECENT_RUNS = 8;

const FIDELITY_KEY_SQL = `CASE s.target_state WHEN 'phi+' THEN 'fidelityPhiPlus' WHEN 'phi-' THEN 'fidelityPhiMinus' WHEN 'psi+' THEN 'fidelityPsiPlus' ELSE 'fidelityPsiMinus' END`;

export async function labHome(labId: string): Promise<LabHome> {
  const [{ sources, sessions, runs }] = await db().query(
    `SELECT (SELECT count(*) FROM sources WHERE lab_id = $1)::int AS sources,
            (SELECT count(*) FROM lab_sessions WHERE lab_id = $1)::int AS sessions,
            (SELECT count(*) FROM runs WHERE lab_id = $1)::int AS runs`,
    [labId],
  );
  const recentSessions = (await listLabSessions(labId, { page: 1, pageSize: RECENT_SESSIONS, sort: "date", order: "desc" })).items;
  const recentRuns = (await listRuns(labId, { page: 1, pageSize: RECENT_RUNS, sort: "createdAt", order: "desc" })).items;
  return { totals: { sources, sessions, runs }, recentSessions, recentRuns, bestBySource: await bestBySource(labId) };
}

/**
 * Per source, the highest fidelity to its target among maximum-likelihood reconstructions of
 * the runs' current counts (with or without corrections — the answer says which).
 */
async function bestBySource(labId: string): Promise<BestFidelity[]> {
  const sourceList = await db().getRepository(Source).find({ where: { labId }, order: { name: "ASC" } });
  const rows: Array<{
    source_id: string; fidelity: number; uncertainty: number | null; method: "mle"; accidentals: boolean; reconstruction_id: string;
    run_id: string; run_name: string; session_id: string; session_title: string; session_date: string;
  }> = await db().query(
    `SELECT DISTINCT ON (s.id)
        s.id AS source_id,
        (rc.metrics->>(${FIDELITY_KEY_SQL}))::float8 AS fidelity,
        (rc.uncertainties->'metrics'->>(${FIDELITY_KEY_SQL}))::float8 AS uncertainty,
        rc.method, (rc.corrections->>'accidentals')::boolean AS accidentals, rc.id AS reconstruction_id,
        r.id AS run_id, r.name AS run_name, ls.id AS session_id, ls.title AS session_title, to_char(ls.session_date, 'YYYY-MM-DD') AS session_date
     FROM sources s
     JOIN lab_sessions ls ON ls.source_id = s.id
     JOIN runs r ON r.session_id = ls.id
     JOIN run_revisions rv ON rv.run_id = r.id AND rv.number = r.current_revision
     JOIN reconstructions rc ON rc.revision_id = rv.id AND rc.method = 'mle'
     WHERE s.lab_id = $1 AND rc.metrics->>(${FIDELITY_KEY_SQL}) IS NOT NULL
     ORDER BY s.id, fidelity DESC, rc.created_at DESC`,
    [labId],
  );
  const bySource = new Map(rows.map((r) => [r.source_id, r]));
  return sourceList.map((source) => {
    const r = bySource.get(source.id);
    return {
      source,
      best: r
        ? {
            fidelity: r.fidelity,
            uncertainty: r.uncertainty,
            method: r.method,
            accidentalsSubtracted: r.accidentals,
            reconstructionId: r.reconstruction_id,
            run: { id: r.run_id, name: r.run_name },
            session: { id: r.session_id, title: r.session_title, date: r.session_date },
          }
        : null,
    };
  });
}

