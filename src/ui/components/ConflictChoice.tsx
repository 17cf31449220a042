import type { Sample } from '../../records/schema';

/**
 * A save met a newer revision of the same sample (another tab or a restore saved it meanwhile).
 * Nothing was overwritten; the crew chooses. Their entry stays on screen and in its draft meanwhile.
 */
export function ConflictChoice({ theirs, onMine, onTheirs, onBoth }: { theirs: Sample; onMine: () => void; onTheirs: () => void; onBoth: () => void }) {
  return (
    <div class="notice warn" role="alertdialog" aria-labelledby="conflict-title" data-testid="conflict">
      <p id="conflict-title">
        <strong>This sample was changed elsewhere</strong> (revision {theirs.revision}, saved {new Date(theirs.updatedAt).toLocaleString()}) while you were editing it. Nothing has been overwritten.
      </p>
      <div class="row3">
        <button type="button" class="btn" onClick={onMine}>Keep mine</button>
        <button type="button" class="btn" onClick={onTheirs}>Keep theirs</button>
        <button type="button" class="btn" onClick={onBoth}>Keep both</button>
      </div>
      <p class="muted">Keep mine saves your entry as the next revision (theirs stays in the history). Keep theirs drops your unsaved changes. Keep both saves yours as a separate sample.</p>
    </div>
  );
}
