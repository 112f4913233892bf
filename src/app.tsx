import { apparentMotion } from './core';

// Placeholder page until the check screen lands: shows the core working on one case.
export function App() {
  const m = apparentMotion({ speedHz: 60, symmetry: 1 }, 61);
  return (
    <main>
      <h1>Trueturn</h1>
      <p>A disc at 3600 rpm under 61 flashes per second looks {m.look} at {(m.apparentHz * 60).toFixed(1)} rpm.</p>
    </main>
  );
}
