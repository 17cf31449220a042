import { EXTRA_PAGES } from '../router';

export function MoreScreen() {
  return (
    <ul class="menu">
      {EXTRA_PAGES.map((p) => (
        <li key={p.id}>
          <a class="menu-item" href={`#/${p.id}`}>{p.title}</a>
        </li>
      ))}
    </ul>
  );
}
