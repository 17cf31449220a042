/** A link that leads nowhere: say so, and offer the way back (never a blank app or "Opening…" forever). */
export function NotFound({ what, detail }: { what: string; detail?: string }) {
  return (
    <div class="notice warn" role="alert" data-testid="not-found">
      <p><strong>{what}</strong></p>
      {detail && <p>{detail}</p>}
      <p><a class="btn" href="#/today">Go to today’s samples</a></p>
    </div>
  );
}
