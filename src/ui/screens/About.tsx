import { ENGINE_VERSION } from '../../chemistry';
import { METHOD_NOTES } from '../methods';

export function AboutScreen() {
  return (
    <section class="prose">
      <p>Bankside computes with published methods only. Engine version {ENGINE_VERSION}; it is stored with every export.</p>
      <dl class="methods">
        {METHOD_NOTES.map((m) => (
          <div key={m.id}>
            <dt>{m.name}</dt>
            <dd>{m.method}<br /><span class="muted">Source: {m.source}</span></dd>
          </div>
        ))}
      </dl>
      <p>Indices are estimates from field readings and published constants. Decisions on drinking-water treatment and corrosion control belong to licensed professionals under local codes.</p>
    </section>
  );
}
