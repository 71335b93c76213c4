import { evaluate, WizardInputError } from '@/lib/wizard/engine';
import type { WizardResult } from '@/lib/wizard/types';
import { evaluateBodySchema, type EvaluateBody } from '@/lib/validation/wizard';
import type { PhoneResult, SaveAnswerWithPhoneBody } from '@/lib/validation/offline';
import type { OfflineWizardData } from '@/lib/data/wizard';
import { OFFLINE_DATA_URL, WIZARD_DATA_CACHE } from '@/lib/offline/cache-names';
import { ApiError, fetcher } from '@/components/fetcher';
import type { SaveRequest } from '@/lib/wizard/ask.machine';
import { currentMemberId } from './member';
import { isOffline, markReachable, markUnreachable } from './connectivity';
import { enqueueSave, newIdempotencyKey } from './queue';

// The wizard's evaluate and save, with or without a signal. Online, the server answers as always.
// When the request cannot reach it, the phone runs the same engine module (lib/wizard/engine.ts)
// on the species data it kept, and a save waits in the IndexedDB queue until the connection returns.

/** How long a request may hang on a weak signal before the phone works it out itself. */
const NETWORK_WAIT_MS = 8_000;

/** Results this phone worked out itself (not the server). */
const onPhone = new WeakSet<WizardResult>();
/** The last result shown, so a save can label its queue entry and send the phone's result along. */
let last: { body: string; result: WizardResult } | null = null;

export function isWorkedOutOnPhone(result: WizardResult | null | undefined): boolean {
  return !!result && onPhone.has(result);
}

/** A failure to reach the server at all, as opposed to an answer from it. */
function isNetworkFailure(e: unknown): boolean {
  if (e instanceof ApiError) return false;
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return true;
  return e instanceof TypeError || (e instanceof DOMException && (e.name === 'TimeoutError' || e.name === 'AbortError' || e.name === 'NetworkError'));
}

function messageOf(e: unknown): string {
  if (e instanceof ApiError) {
    const fields = e.body.fields
      ? Object.entries(e.body.fields)
          .map(([k, v]) => `${k}: ${v.join(', ')}`)
          .join('; ')
      : '';
    return fields ? `${e.body.message} (${fields})` : e.body.message;
  }
  return e instanceof Error ? e.message : 'Something went wrong.';
}

/** The species data and club settings kept for offline use: the worker's copy, else the cache itself. */
async function offlineData(): Promise<OfflineWizardData | null> {
  try {
    const res = await fetch(OFFLINE_DATA_URL, { headers: { accept: 'application/json' }, signal: AbortSignal.timeout(NETWORK_WAIT_MS) });
    if (res.ok) return (await res.json()) as OfflineWizardData;
  } catch {}
  if (typeof caches === 'undefined') return null;
  const cached = await (await caches.open(WIZARD_DATA_CACHE)).match(new URL(OFFLINE_DATA_URL, window.location.origin).href);
  return cached ? ((await cached.json()) as OfflineWizardData) : null;
}

const todayIso = () => new Date().toISOString().slice(0, 10);

/** Runs the engine on the phone, with the same input rules as the server. */
export async function evaluateOnPhone(input: EvaluateBody, data?: OfflineWizardData | null): Promise<WizardResult> {
  const parsed = evaluateBodySchema.safeParse(input);
  if (!parsed.success) throw new Error(parsed.error.issues.map((i) => i.message).join(' '));
  const kept = data ?? (await offlineData());
  if (!kept) throw new Error('No connection, and this phone has not kept the species yet. Open the wizard once with a signal, then it works offline.');
  const species = kept.species.find((s) => s.slug === parsed.data.species);
  if (!species) throw new Error('No connection, and this species is not among those kept on this phone.');
  let result: WizardResult;
  try {
    result = evaluate(parsed.data, species, { ...kept.context, today: todayIso() });
  } catch (e) {
    if (e instanceof WizardInputError) throw new Error(e.message);
    throw e;
  }
  onPhone.add(result);
  last = { body: JSON.stringify(input), result };
  return result;
}

/** The wizard's evaluate: the server when it can be reached, else the phone. */
export async function evaluateAnywhere(input: EvaluateBody): Promise<WizardResult> {
  try {
    const result = await fetcher<WizardResult>('/api/wizard/evaluate', {
      method: 'POST',
      body: JSON.stringify(input),
      signal: AbortSignal.timeout(NETWORK_WAIT_MS),
    });
    markReachable();
    last = { body: JSON.stringify(input), result };
    return result;
  } catch (e) {
    if (!isNetworkFailure(e)) {
      markReachable();
      throw new Error(messageOf(e));
    }
    markUnreachable();
    return evaluateOnPhone(input);
  }
}

/** Where a queued save's panel points until the server has it. */
const WAITING_URL = '/answers#waiting-to-send';

export function isWaiting(saved: { url: string } | null | undefined): boolean {
  return saved?.url === WAITING_URL;
}

function lastResultFor(body: EvaluateBody): WizardResult | null {
  return last && last.body === JSON.stringify(body) ? last.result : null;
}

/**
 * The wizard's save. Every save carries an Idempotency-Key. When the server cannot be reached the
 * save joins the queue and the panel shows it as waiting (its id is the key until it is sent).
 */
export async function saveAnywhere(input: SaveRequest): Promise<{ id: string; url: string }> {
  const shown = lastResultFor(input.body);
  const phoneResult = shown && onPhone.has(shown) ? (shown as unknown as PhoneResult) : undefined;
  const body: SaveAnswerWithPhoneBody = {
    ...input.body,
    visibility: input.visibility,
    ...(input.note ? { note: input.note } : {}),
    ...(input.treeId ? { treeId: input.treeId } : {}),
    ...(phoneResult ? { phoneResult } : {}),
  };
  const key = newIdempotencyKey();
  const userId = currentMemberId();
  const queue = async () => {
    if (!userId) throw new Error('No connection, and this phone does not know who is signed in. Save again once you are back online.');
    await enqueueSave({
      key,
      userId,
      body,
      label: { speciesName: shown?.speciesName ?? input.body.species, headline: shown?.headline ?? '', date: input.body.date },
    });
    return { id: key, url: WAITING_URL };
  };
  if (isOffline()) return queue();
  try {
    const r = await fetcher<{ id: string; url: string }>('/api/answers', {
      method: 'POST',
      body: JSON.stringify(body),
      headers: { 'Idempotency-Key': key },
      signal: AbortSignal.timeout(NETWORK_WAIT_MS * 2),
    });
    markReachable();
    return { id: r.id, url: r.url };
  } catch (e) {
    if (!isNetworkFailure(e)) {
      markReachable();
      throw new Error(messageOf(e));
    }
    markUnreachable();
    return queue();
  }
}
