import { Link } from "react-router-dom";
import { PageTitle } from "../components/PageTitle";
import { Panel } from "../components/Panel";

const STEPS = [
  { title: "Describe the setup", text: "Source, pump, detectors, coincidence window, waveplate calibrations and handedness." },
  { title: "Plan and record", text: "Pick a setting set, turn the waveplates to the listed angles and type or upload the counts." },
  { title: "Reconstruct and judge", text: "Linear inversion and maximum likelihood, with fidelity, concurrence, CHSH and their uncertainties." },
  { title: "Compare and share", text: "Follow a source across sessions and send a reconstructed state to a collaborator." },
];

export function HomePage() {
  return (
    <>
      <PageTitle subtitle="A shared notebook for two-photon polarization tomography.">Notebook</PageTitle>
      <div className="grid gap-4 md:grid-cols-2 lg:grid-cols-4">
        {STEPS.map((step, i) => (
          <Panel key={step.title}>
            <p className="text-sm font-bold text-petrol-600">Step {i + 1}</p>
            <h2 className="mt-1 text-lg font-bold">{step.title}</h2>
            <p className="mt-2 text-ink-soft">{step.text}</p>
          </Panel>
        ))}
      </div>
      <p className="mt-6 text-ink-soft">
        Is everything running? See the <Link className="font-bold text-petrol-700 underline" to="/status">system status</Link>.
      </p>
    </>
  );
}
