/** Dampers: not built yet. */
export function DampersScreen() {
  return (
    <section>
      <h2>Dampers</h2>
      <p>This screen is not built yet.</p>
    </section>
  );
}
