export function NewSampleScreen() {
  return (
    <section>
      <p class="lead">Enter what you measure at the site; the saturation state appears as you type.</p>
      <p class="muted">The sample form arrives with the field-app work. Nothing is recorded yet on this screen.</p>
    </section>
  );
}
