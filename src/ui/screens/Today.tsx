export function TodayScreen() {
  const today = new Date().toLocaleDateString(undefined, { weekday: 'long', day: 'numeric', month: 'long' });
  return (
    <section>
      <p class="lead">{today}</p>
      <div class="empty">
        <p>No samples recorded today.</p>
        <a class="btn btn-primary btn-block" href="#/new">Start a new sample</a>
      </div>
    </section>
  );
}
