/** Valving: not built yet. */
export function ValvingScreen() {
  return (
    <section>
      <h2>Valving</h2>
      <p>This screen is not built yet.</p>
    </section>
  );
}
