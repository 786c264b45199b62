import type { Snapshot } from "@shared/schemas/shares";
import { formatDecimal } from "@shared/format/uncertainty";
import { BELL_SYMBOL } from "../stateView/meritRows";

const orDash = (parts: Array<string | false>) => parts.filter(Boolean).join(", ") || "—";

/** The source and the session's setup, as a shared item or a report shows them. */
export function SnapshotSetup({ setup }: { setup: Snapshot["setup"] }) {
  const { source: src, session: s } = setup;
  const calibrated = s.calibration.some((a) => a.qwp.fastAxisOffsetDeg || a.qwp.retardanceErrorDeg || a.hwp.fastAxisOffsetDeg || a.hwp.retardanceErrorDeg);
  const items: [string, string][] = [
    ["Source", orDash([src.name, src.crystal])],
    ["Pump laser", src.pumpLaser || "—"],
    // The session's own pump settings, as on the session page (the laser's text may name a wavelength too).
    ["Pump", orDash([s.pumpWavelengthNm !== null && `${formatDecimal(s.pumpWavelengthNm, 3)} nm`, s.pumpPowerMw !== null && `${formatDecimal(s.pumpPowerMw, 3)} mW`])],
    ["Pair wavelength", src.wavelengthNm !== null ? `${formatDecimal(src.wavelengthNm, 3)} nm` : "—"],
    ["Target state", BELL_SYMBOL[src.targetState]],
    ["Session", `${s.title}, ${s.date}`],
    ["Crystal temperature", s.crystalTemperatureC !== null ? `${formatDecimal(s.crystalTemperatureC, 3)} °C` : "—"],
    ["Detectors", s.detectors || "—"],
    ["Coincidence window", s.coincidenceWindowNs !== null ? `${formatDecimal(s.coincidenceWindowNs, 3)} ns` : "not recorded"],
    ["Analysers", `QWP → HWP → PBS per arm; PBS ports counted: ${s.analyser.arms.map((a, i) => `${"AB"[i]} ${a.bothPorts ? "both" : "one"}`).join(", ")}`],
    [
      "Waveplate calibration",
      calibrated
        ? s.calibration.map((a, i) => `${"AB"[i]}: QWP ${formatDecimal(a.qwp.fastAxisOffsetDeg, 2)}° / ${formatDecimal(a.qwp.retardanceErrorDeg, 2)}°, HWP ${formatDecimal(a.hwp.fastAxisOffsetDeg, 2)}° / ${formatDecimal(a.hwp.retardanceErrorDeg, 2)}°`).join("; ") + " (axis offset / retardance error)"
        : "ideal plates (no offsets)",
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
      {s.notes && <p className="mt-3 whitespace-pre-wrap text-sm text-ink-soft">{s.notes}</p>}
    </div>
  );
}
