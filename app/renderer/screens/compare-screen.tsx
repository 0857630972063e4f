/** Compare: not built yet. */
export function CompareScreen() {
  return (
    <section>
      <h2>Compare</h2>
      <p>This screen is not built yet.</p>
    </section>
  );
}
