import { afterEach, describe, expect, it, vi } from 'vitest';
import { evaluateAnywhere, evaluateOnPhone, isWorkedOutOnPhone } from '@/components/offline/evaluate-anywhere';
import { evaluate } from '@/lib/wizard/engine';
import { ENGINE_VERSION } from '@/lib/wizard/rules';
import type { EvaluateBody } from '@/lib/validation/wizard';
import { shippedSpecies } from '../../support/shipped-species';

// The phone runs the very engine module the server runs, on the species data it kept.
const data = { context: { hemisphere: 'north' as const, latitude: 45.5, decandleOffsetDays: 0 }, species: shippedSpecies };
const body: EvaluateBody = {
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  date: '2027-05-10',
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
};

/** fetch as on a phone with no signal: every request fails, except the worker's kept copy of the species data. */
function offlineFetch(kept: boolean) {
  return vi.fn(async (url: string) => {
    if (kept && url === '/api/wizard/offline-data') return new Response(JSON.stringify(data), { status: 200 });
    throw new TypeError('Failed to fetch');
  });
}

afterEach(() => vi.unstubAllGlobals());

describe('evaluating with or without a signal', () => {
  it('with no signal works the answer out on the phone, the same as the engine does, and marks it', async () => {
    vi.stubGlobal('fetch', offlineFetch(true));
    const result = await evaluateAnywhere(body);
    const scots = shippedSpecies.find((s) => s.slug === 'pinus-sylvestris')!;
    const today = new Date().toISOString().slice(0, 10);
    expect(result).toEqual(evaluate(body, scots, { ...data.context, today }));
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    expect(result.speciesRevision).toBe(scots.revision);
    expect(isWorkedOutOnPhone(result)).toBe(true);
  });

  it("uses the server's answer when it can be reached, and does not mark it", async () => {
    const server = {
      ...evaluate(
        body,
        shippedSpecies.find((s) => s.slug === 'pinus-sylvestris')!,
        { ...data.context, today: '2027-05-10' },
      ),
      headline: 'from the server',
    };
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify(server), { status: 200 })),
    );
    const result = await evaluateAnywhere(body);
    expect(result.headline).toBe('from the server');
    expect(isWorkedOutOnPhone(result)).toBe(false);
  });

  it("passes on the server's refusal instead of working it out on the phone", async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(
            JSON.stringify({ error: { code: 'bad_request:fields', message: 'Invalid input', fields: { date: ['Give a real date as YYYY-MM-DD.'] } } }),
            { status: 400 },
          ),
      ),
    );
    await expect(evaluateAnywhere(body)).rejects.toThrow('Invalid input (date: Give a real date as YYYY-MM-DD.)');
  });

  it('says plainly when the phone has no species data kept yet', async () => {
    vi.stubGlobal('fetch', offlineFetch(false));
    await expect(evaluateAnywhere(body)).rejects.toThrow(/has not kept the species yet/);
  });

  it('refuses on the phone what the server refuses: the same input schema', async () => {
    await expect(evaluateOnPhone({ ...body, position: undefined }, data)).rejects.toThrow('Say where the shoot is against the silhouette.');
    await expect(evaluateOnPhone({ ...body, species: 'pinus-nowhere' }, data)).rejects.toThrow(/not among those kept/);
  });
});
