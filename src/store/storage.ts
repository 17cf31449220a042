// Persistent storage and the storage estimate, shown to the crew in settings.
export interface StorageStatus {
  persisted: boolean | 'unsupported';
  usageBytes?: number;
  quotaBytes?: number;
}

/** Ask the browser not to evict our data (it may say no: headless Chromium does), and report. */
export async function requestPersistence(): Promise<StorageStatus> {
  const sm = (globalThis.navigator as Navigator | undefined)?.storage;
  if (!sm || typeof sm.persist !== 'function') return { persisted: 'unsupported' };
  let persisted = false;
  try {
    persisted = (await sm.persisted()) || (await sm.persist());
  } catch {
    persisted = false;
  }
  const est = typeof sm.estimate === 'function' ? await sm.estimate().catch(() => ({}) as StorageEstimate) : ({} as StorageEstimate);
  return { persisted, usageBytes: est.usage, quotaBytes: est.quota };
}

export function formatBytes(n: number | undefined): string {
  if (n === undefined) return 'unknown';
  if (n < 1024) return `${n} B`;
  if (n < 1024 ** 2) return `${(n / 1024).toFixed(0)} kB`;
  if (n < 1024 ** 3) return `${(n / 1024 ** 2).toFixed(1)} MB`;
  return `${(n / 1024 ** 3).toFixed(1)} GB`;
}
