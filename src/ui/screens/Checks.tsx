export function ChecksScreen() {
  return (
    <section>
      <p class="lead">Calibrate and check each meter before and after sampling: pH buffers, a conductance standard, oxygen in air.</p>
      <div class="empty"><p>No meter checks logged today.</p></div>
    </section>
  );
}
