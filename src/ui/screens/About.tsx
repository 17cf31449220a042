export function AboutScreen() {
  return (
    <section class="prose">
      <p>Bankside computes with published methods only. Each result names its method and source.</p>
    </section>
  );
}
