import { Link } from 'react-router-dom';

const jobs = [
  ['Draw and solve', 'Place dividers, bias networks, thermistor and light sensors, Zener references and LEDs; read every node voltage and part current at once.'],
  ['Values you can buy', 'Snap to E6…E192 preferred values, find series/parallel pairs, and let the divider designer rank real combinations.'],
  ['Tolerance and loading', 'Worst-case windows and Monte Carlo spread over part tolerances and the supply range, with the load the tap drives.'],
  ['Power and budgets', 'Dissipation against ratings with derating, quiescent current, Thevenin resistance at any net.'],
  ['Together', 'Cloud projects with roles, revisions and live co-editing for design reviews.'],
] as const;

export function HomePage() {
  return (
    <div className="mx-auto max-w-4xl px-6 py-10">
      <h1 className="text-3xl font-semibold tracking-tight">Design DC networks you can build</h1>
      <p className="mt-3 max-w-2xl text-ink-muted">
        Tapline is a workbench for the resistive and semiconductor networks around every sensor, reference and
        indicator: from the ideal ratio to the part on the reel, its tolerance, its heat and what the tap drives.
      </p>
      <div className="mt-6 flex gap-3">
        <Link to="/sheets/local" className="rounded bg-accent px-4 py-2 font-medium text-accent-ink">Open a local sheet</Link>
      </div>
      <ul className="mt-10 grid gap-4 sm:grid-cols-2">
        {jobs.map(([title, text]) => (
          <li key={title} className="rounded border border-rule bg-panel p-4">
            <h2 className="font-medium">{title}</h2>
            <p className="mt-1 text-sm text-ink-muted">{text}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
