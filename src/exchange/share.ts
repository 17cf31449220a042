// Hand a file to the system share sheet where the browser can (Web Share with files), else download.
export type ShareOutcome = 'shared' | 'downloaded' | 'cancelled';

/** `content` may be a Blob built from parts (big exports): it is handed over without copying into one string. */
export async function shareOrDownload(fileName: string, content: string | Blob, type: string): Promise<ShareOutcome> {
  const file = new File([content], fileName, { type });
  const nav = navigator as Navigator & { canShare?: (d: ShareData) => boolean };
  if (typeof nav.share === 'function' && typeof nav.canShare === 'function' && nav.canShare({ files: [file] })) {
    try {
      await nav.share({ files: [file], title: fileName });
      return 'shared';
    } catch (e) {
      if (e instanceof DOMException && e.name === 'AbortError') return 'cancelled';
      // TypeError / NotAllowedError: fall through to a download
    }
  }
  downloadBlob(fileName, file);
  return 'downloaded';
}

/** Save a blob through the browser's download (works offline: nothing leaves the phone). */
export function downloadBlob(fileName: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function downloadText(fileName: string, text: string, type: string): void {
  downloadBlob(fileName, new Blob([text], { type }));
}
