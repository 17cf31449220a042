export function SitesScreen() {
  return (
    <section>
      <p class="lead">Streams, springs and wells you sample, with their coordinates and datum.</p>
      <div class="empty"><p>No sites yet.</p></div>
    </section>
  );
}
