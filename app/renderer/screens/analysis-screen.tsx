/** Ride figures: not built yet. */
export function AnalysisScreen() {
  return (
    <section>
      <h2>Ride figures</h2>
      <p>This screen is not built yet.</p>
    </section>
  );
}
