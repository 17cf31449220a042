export function SettingsScreen() {
  return (
    <section>
      <p class="lead">Units, the method profile, the activity model and the office address.</p>
      <p class="muted">Defaults are in use. Settings become editable with the record store.</p>
    </section>
  );
}
