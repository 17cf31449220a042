// Files the system hands to the installed app: the manifest's file_handlers entry lets a crew or
// office open a lab's CSV with Bankside, which lands here (File Handling API, `launchQueue`) and
// goes straight into the lab import.
type Listener = (file: File) => void;

interface LaunchParams {
  files?: ReadonlyArray<{ getFile(): Promise<File> }>;
}
interface LaunchQueue {
  setConsumer(consumer: (params: LaunchParams) => void): void;
}

let pending: File | null = null;
const listeners = new Set<Listener>();

/** Start listening for launched files (once, at app start); opens the lab import when one arrives. */
export function startLaunchQueue(): void {
  const queue = (window as unknown as { launchQueue?: LaunchQueue }).launchQueue;
  if (!queue) return;
  queue.setConsumer((params) => {
    const handle = params.files?.[0];
    if (!handle) return;
    void handle.getFile().then((file) => {
      if (listeners.size > 0) for (const l of listeners) l(file);
      else pending = file;
      if (!location.hash.startsWith('#/lab')) location.hash = '#/lab';
    });
  });
}

/** The lab import takes the launched file (now or when it arrives); returns an unsubscribe. */
export function onLaunchedFile(listener: Listener): () => void {
  if (pending) {
    const f = pending;
    pending = null;
    listener(f);
  }
  listeners.add(listener);
  return () => listeners.delete(listener);
}
