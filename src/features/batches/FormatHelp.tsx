import { Link } from "react-router-dom";
import { LIMITS } from "@shared/limits";
import { Panel } from "../../components/Panel";
import { megabytes } from "./batchFileChecks";

const SWEEP = "run,pump_mw,HH,HV,VV,VH,…\n1 mW,1,14,744,4,764,…\n2 mW,2,29,1503,11,1487,…";
const JSON_RUN = '{ "format": "rhomb-run/1",\n  "name": "5 mW", "settingSetId": "tomo16",\n  "rows": [ { "setting": "HH", "counts": 12 }, … ] }';

/** The layouts a batch takes, the limits, and how to post from an acquisition script. */
export function FormatHelp({ sessionId }: { sessionId: string | null }) {
  return (
    <div className="min-w-0 space-y-4">
      <Panel title="What a batch takes">
        <dl className="space-y-3 text-sm">
          <div>
            <dt className="font-bold text-ink">One-run CSV</dt>
            <dd className="text-ink-soft">
              <code className="break-all">basis,counts[,seconds,singles_a,singles_b,monitor]</code>, one row per setting — as on the new-run page.
            </dd>
          </div>
          <div>
            <dt className="font-bold text-ink">Sweep CSV — one run per line</dt>
            <dd className="text-ink-soft">
              A column per setting label, optional run, set, seconds, pump_mw, crystal_c, tilt_deg, notes and &lt;label&gt;_singles_a/_b.
              <pre className="mt-1 overflow-x-auto rounded bg-paper-sunk p-2 text-xs text-ink">{SWEEP}</pre>
            </dd>
          </div>
          <div>
            <dt className="font-bold text-ink">One-run JSON</dt>
            <dd className="text-ink-soft">
              The fields of the API's run body; it may choose its own reconstruction.
              <pre className="mt-1 whitespace-pre-wrap break-all rounded bg-paper-sunk p-2 text-xs text-ink">{JSON_RUN}</pre>
            </dd>
          </div>
          <div>
            <dt className="font-bold text-ink">Zip archives</dt>
            <dd className="text-ink-soft">Of any of these, folders allowed.</dd>
          </div>
        </dl>
        <p className="mt-3 text-xs text-ink-faint">
          Limits: {LIMITS.batchFiles.toLocaleString("en")} runs per batch (each zip member and sweep line counts), {megabytes(LIMITS.uploadBytes)} per run file,{" "}
          {megabytes(LIMITS.batchUploadBytes)} per upload, zips unpacking to at most {LIMITS.zipExpansionRatio}× their size. A file stored before (same bytes) is
          recognised and not stored twice.
        </p>
      </Panel>
      <Panel title="From the acquisition PC">
        <p className="text-sm text-ink-soft">
          Create a personal API token on the <Link className="font-bold text-petrol-700 underline" to="/tokens">API tokens</Link> page, then after each run:
        </p>
        <pre className="mt-2 overflow-x-auto whitespace-pre rounded bg-paper-sunk p-2 text-xs">{`export RHOMB_URL=${window.location.origin}\nexport RHOMB_TOKEN=rhb_…\nnpm run --silent rhomb -- upload \\\n  --session ${sessionId ?? "<session id>"} \\\n  run-0042.csv`}</pre>
        {sessionId && <p className="mt-2 text-xs text-ink-faint">Session id: <code className="select-all">{sessionId}</code></p>}
      </Panel>
    </div>
  );
}
