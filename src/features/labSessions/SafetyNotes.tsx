import { Alert } from "../../components/Alert";

/** Shown wherever pump-laser parameters are entered. */
export function LaserCaution({ compact = false }: { compact?: boolean }) {
  const text = (
    <>
      Pump lasers for pair sources are often class 3B or 4. Wear eye protection rated for the pump wavelength, keep beams enclosed and at table height, and
      follow your institution's laser safety officer and local rules — they decide what is required, not this notebook.
    </>
  );
  if (compact) return <p className="rounded border-l-4 border-caution-edge bg-caution-soft px-3 py-1.5 text-xs text-ink" role="note">⚠ {text}</p>;
  return (
    <Alert kind="caution" title="Laser safety">
      {text}
    </Alert>
  );
}

/** Shown wherever detectors are configured. */
export function DetectorCaution() {
  return (
    <Alert kind="caution" title="Detectors: high voltage and cryogens">
      Avalanche photodiode modules run on high bias voltages, and superconducting detectors need cryogens or cryocoolers (cold burns, asphyxiation in closed
      rooms). Work on them only as your institution's safety rules and the manufacturer's instructions allow.
    </Alert>
  );
}
