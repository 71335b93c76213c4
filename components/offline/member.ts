import { ASK_PAGE_CACHE, MEMBER_CACHES, MEMBER_DATA_CACHE, OFFLINE_DATA_URL, WIZARD_DATA_CACHE } from '@/lib/offline/cache-names';

// Which member this browser last rendered a page for, and the caches that hold what they saw.
// The id comes from the server-rendered layout (also when the wizard page is served from the
// service worker's copy), so an answer queued offline is sent only for the member who made it.

const MEMBER_KEY = 'candlewise.member';

let current: string | null = null;

export function currentMemberId(): string | null {
  return current;
}

/** Empties every cache that can hold one member's pages or trees. */
export async function clearMemberCaches(): Promise<void> {
  if (typeof caches === 'undefined') return;
  await Promise.all(MEMBER_CACHES.map((name) => caches.delete(name)));
}

/**
 * Records who is signed in. When that changes (a sign-out, the session running out, another
 * member signing in on this phone) the previous member's cached pages and trees are dropped.
 */
export async function setCurrentMember(userId: string | null): Promise<void> {
  current = userId;
  let before: string | null = null;
  try {
    before = localStorage.getItem(MEMBER_KEY);
    if (userId) localStorage.setItem(MEMBER_KEY, userId);
    else localStorage.removeItem(MEMBER_KEY);
  } catch {}
  if (before !== userId && before !== null) await clearMemberCaches();
}

/**
 * Keeps what the wizard needs with no signal, once per visit: the wizard page as rendered for this
 * member, the published species with the club's settings, and the member's trees. Stored straight
 * into the caches the service worker answers from, so it works on the very first visit too, before
 * the worker controls the page.
 */
export async function warmOfflineCopies(signedIn: boolean): Promise<void> {
  if (typeof caches === 'undefined') return;
  const flag = `candlewise.warmed.${signedIn ? current : 'guest'}`;
  try {
    if (sessionStorage.getItem(flag)) return;
  } catch {}
  const wanted: [string, string][] = [
    [OFFLINE_DATA_URL, WIZARD_DATA_CACHE],
    ['/ask', ASK_PAGE_CACHE],
    ...(signedIn ? ([['/api/trees', MEMBER_DATA_CACHE]] as [string, string][]) : []),
  ];
  const done = await Promise.all(
    wanted.map(async ([path, cacheName]) => {
      try {
        const url = new URL(path, window.location.origin).href;
        const res = await fetch(url, { headers: { accept: path.startsWith('/api/') ? 'application/json' : 'text/html' }, credentials: 'same-origin' });
        if (res.status !== 200) return false;
        await (await caches.open(cacheName)).put(url, res);
        return true;
      } catch {
        return false;
      }
    }),
  );
  if (done.every(Boolean)) {
    try {
      sessionStorage.setItem(flag, '1');
    } catch {}
  }
}
