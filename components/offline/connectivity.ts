// Whether Candlewise can be reached, as best the page can tell. `navigator.onLine` alone is not
// enough: on a phone it stays true on a network with no way out, and it says nothing of the server.
// So a request that fails for want of a network marks the server unreachable; a probe then checks
// every few seconds, and the first request that gets through (or the browser's `online` event)
// marks it reachable again.

const PROBE_URL = '/api/health';
const PROBE_EVERY_MS = 5_000;

let unreachable = false;
let timer: ReturnType<typeof setInterval> | null = null;
const listeners = new Set<() => void>();

function emit() {
  for (const l of listeners) l();
}

/** True while the browser says it is offline or the last attempt could not reach the server. */
export function isOffline(): boolean {
  if (typeof navigator === 'undefined') return false;
  return navigator.onLine === false || unreachable;
}

export function subscribeConnectivity(cb: () => void): () => void {
  listeners.add(cb);
  if (listeners.size === 1 && typeof window !== 'undefined') {
    window.addEventListener('online', onBrowserOnline);
    window.addEventListener('offline', emit);
  }
  return () => {
    listeners.delete(cb);
    if (listeners.size === 0 && typeof window !== 'undefined') {
      window.removeEventListener('online', onBrowserOnline);
      window.removeEventListener('offline', emit);
    }
  };
}

function onBrowserOnline() {
  void probe();
  emit();
}

export function markReachable(): void {
  if (timer) clearInterval(timer);
  timer = null;
  if (!unreachable) return;
  unreachable = false;
  emit();
}

export function markUnreachable(): void {
  if (!timer && typeof window !== 'undefined') timer = setInterval(() => void probe(), PROBE_EVERY_MS);
  if (unreachable) return;
  unreachable = true;
  emit();
}

/** Asks the server once; true when it answered at all (any status means it is reachable). */
export async function probe(): Promise<boolean> {
  try {
    await fetch(PROBE_URL, { cache: 'no-store', signal: AbortSignal.timeout(5_000) });
    markReachable();
    return true;
  } catch {
    markUnreachable();
    return false;
  }
}
