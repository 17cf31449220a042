// The baseline for the cold-start benchmark: the smallest Preact page with one input, built and
// served with a precaching service worker the same way as Bankside.
import { render } from 'preact';

function Bare() {
  return (
    <main>
      <h1>Bare page</h1>
      <label for="temp-0">Water temperature</label>
      <input id="temp-0" inputMode="decimal" />
    </main>
  );
}
render(<Bare />, document.getElementById('app')!);
