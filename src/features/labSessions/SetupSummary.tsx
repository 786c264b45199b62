import type { LabSessionDto } from "@shared/schemas/labSessions";
import { formatDecimal } from "@shared/format/uncertainty";

/** A session's setup at a glance. */
export function SetupSummary({ session: s }: { session: LabSessionDto }) {
  const calibrated = s.calibration.some((a) => a.qwp.fastAxisOffsetDeg || a.qwp.retardanceErrorDeg || a.hwp.fastAxisOffsetDeg || a.hwp.retardanceErrorDeg);
  const items: [string, React.ReactNode][] = [
    ["Source", s.source.name],
    ["Date", s.date],
    ["People", s.people.length ? s.people.join(", ") : "—"],
    ["Pump", [s.pumpWavelengthNm !== null && `${formatDecimal(s.pumpWavelengthNm, 3)} nm`, s.pumpPowerMw !== null && `${formatDecimal(s.pumpPowerMw, 3)} mW`].filter(Boolean).join(", ") || "—"],
    ["Crystal temperature", s.crystalTemperatureC !== null ? `${formatDecimal(s.crystalTemperatureC, 3)} °C` : "—"],
    ["Detectors", s.detectors || "—"],
    ["Coincidence window", s.coincidenceWindowNs !== null ? `${formatDecimal(s.coincidenceWindowNs, 3)} ns` : "not set (no accidental subtraction)"],
    ["PBS ports counted", s.analyser.arms.map((a, i) => `${i === 0 ? "A" : "B"}: ${a.bothPorts ? "both" : "one"}`).join(", ")],
    [
      "Waveplates",
      calibrated
        ? s.calibration
            .map((a, i) => `${i === 0 ? "A" : "B"}: QWP ${formatDecimal(a.qwp.fastAxisOffsetDeg, 2)}°/${formatDecimal(a.qwp.retardanceErrorDeg, 2)}°, HWP ${formatDecimal(a.hwp.fastAxisOffsetDeg, 2)}°/${formatDecimal(a.hwp.retardanceErrorDeg, 2)}°`)
            .join("; ") + " (axis offset / retardance error)"
        : "ideal (no calibrations)",
    ],
    ["Handedness", s.handedness === "R=H+iV" ? "|R⟩ = (|H⟩ + i|V⟩)/√2" : "|R⟩ = (|H⟩ − i|V⟩)/√2"],
  ];
  return (
    <div>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        {items.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-faint">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
      </dl>
      {s.notes && (
        <p className="mt-3 whitespace-pre-wrap text-sm text-ink-soft">
          {s.notesPrivate && <span className="mr-1 font-bold text-ink">Members only:</span>}
          {s.notes}
        </p>
      )}
    </div>
  );
}
