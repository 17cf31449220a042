// Our own line icons for the navigation bar (24 px grid, stroke only).
const PATHS: Record<string, string> = {
  today: 'M4 5h16v15H4zM4 9h16M8 3v4M16 3v4M8 13h3M8 16h6',
  new: 'M12 5v14M5 12h14',
  sites: 'M12 21s-6-6.2-6-11a6 6 0 0 1 12 0c0 4.8-6 11-6 11zM12 12.5a2.5 2.5 0 1 0 0-5 2.5 2.5 0 0 0 0 5z',
  checks: 'M9 3h6M10 3v6l-5 9a2 2 0 0 0 1.7 3h10.6a2 2 0 0 0 1.7-3l-5-9V3M7.5 15h9',
  send: 'M4 12l16-8-6 16-3-7-7-1zM11 13l9-9',
  more: 'M5 7h14M5 12h14M5 17h14',
};

export function Icon({ name }: { name: string }) {
  return (
    <svg class="icon" viewBox="0 0 24 24" width="24" height="24" aria-hidden="true" focusable="false">
      <path d={PATHS[name] ?? ''} fill="none" stroke="currentColor" stroke-width="2" stroke-linecap="round" stroke-linejoin="round" />
    </svg>
  );
}
