import { formatDecimal } from "@shared/format/uncertainty";
import type { LabSessionDto } from "@shared/schemas/labSessions";
import type { GridRow } from "./gridRows";
import "./settingSheet.css";

/**
 * The printable setting sheet: waveplate angles per setting and empty boxes for the counts,
 * for the clipboard at the optical table. Invisible on screen; `window.print()` shows only it.
 */
export function SettingSheetPrint({ rows, setName, session }: { rows: GridRow[]; setName: string; session: LabSessionDto }) {
  const cal = session.calibration.some((a) => a.qwp.fastAxisOffsetDeg || a.qwp.retardanceErrorDeg || a.hwp.fastAxisOffsetDeg || a.hwp.retardanceErrorDeg);
  return (
    <div className="rhomb-setting-sheet hidden" aria-hidden="true">
      <h1 style={{ fontSize: "14pt", fontWeight: 700 }}>Waveplate sheet — {setName}</h1>
      <p>
        Session “{session.title}”, {session.date}, source {session.source.name}. Handedness {session.handedness}.{" "}
        {cal ? "Angles include this session's waveplate calibrations." : "Ideal waveplates (no calibrations set)."} Angles are the mount readings to set; ≈ marks states these plates reach only approximately.
      </p>
      <table style={{ borderCollapse: "collapse", marginTop: "8pt", width: "100%" }}>
        <thead>
          <tr>
            <th>#</th>
            <th>Outcome</th>
            <th>A: QWP</th>
            <th>A: HWP</th>
            <th>B: QWP</th>
            <th>B: HWP</th>
            <th>Port (A, B)</th>
            <th style={{ width: "25%" }}>Coincidences</th>
            <th style={{ width: "12%" }}>Exposure (s)</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={`${r.label}-${i}`}>
              <td>{i + 1}</td>
              <td>{r.label}</td>
              {r.arms.length
                ? r.arms.flatMap((a, arm) => {
                    const approx = a.reach < 0.99999 ? "≈" : "";
                    return [<td key={`q${arm}`}>{approx}{formatDecimal(a.qwpDeg, 2)}°</td>, <td key={`h${arm}`}>{approx}{formatDecimal(a.hwpDeg, 2)}°</td>];
                  })
                : [0, 1, 2, 3].map((k) => <td key={k}>—</td>)}
              <td>{r.arms.map((a) => (a.port === "reflected" ? "refl." : "trans.")).join(", ")}</td>
              <td />
              <td />
            </tr>
          ))}
        </tbody>
      </table>
      <p style={{ marginTop: "8pt" }}>Laser safety: wear eye protection rated for the pump wavelength; the institution's laser safety officer and local rules decide what is required.</p>
    </div>
  );
}
