import autocannon from 'autocannon';
import { describe, expect, it } from 'vitest';
import { evaluateBodies } from '../../bench/http';
import { signedIn } from '../support/http-client';
import { A, B, sameBrowserOn } from './helpers';

// The benchmark's soak mix (bench/soak.ts: the wizard's evaluate, species search, a member's reads
// and answer saves) at its 10 connections, spread over both processes at once with one member's
// session. The test pass runs the benchmark's ten minutes (scripts/test-all.sh sets
// CLUSTER_SOAK_SECONDS=600); run alone, the suite soaks for 30 s. Correctness only: no errors, no
// non-2xx answers, and every answer saved through one process readable through the other. Speed
// and memory are the benchmark's.
const SECONDS = Number(process.env.CLUSTER_SOAK_SECONDS ?? 30);
const CONNECTIONS_PER_PROCESS = 5;

describe('mixed traffic over both processes', () => {
  it(
    'loses nothing',
    async () => {
      const bodies = await evaluateBodies(A);
      expect(bodies, 'wizard request bodies').not.toBeNull();
      const member = await signedIn(A, 'member@candlewise.test');
      const cookie = member.cookieHeader();
      const trees = (await member.json<{ items: { id: string }[] }>('/api/trees', 'GET')).body.items;
      const queries = ['sylvestris', 'mugo', 'thunbergi', 'blak pine', 'scots', 'larch', 'juniper'];
      const reads = ['/api/answers', '/api/trees', '/api/notes', ...(trees[0] ? [`/api/trees/${trees[0].id}/plan`] : [])];

      const traffic = (base: string, seed: number) => {
        const saved: string[] = [];
        let saveFailures = 0;
        let n = 0;
        const rnd = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
        const run = autocannon({
          url: base,
          connections: CONNECTIONS_PER_PROCESS,
          duration: SECONDS,
          requests: [
            {
              method: 'GET',
              path: '/api/health',
              setupRequest: (req: Record<string, unknown>) => {
                const x = rnd();
                const body = bodies![n++ % bodies!.length];
                if (x < 0.3) return { ...req, method: 'POST', path: '/api/wizard/evaluate', headers: { 'content-type': 'application/json' }, body };
                if (x < 0.55) return { ...req, method: 'GET', path: `/api/species?q=${encodeURIComponent(queries[n % queries.length])}`, headers: {} };
                if (x < 0.85) return { ...req, method: 'GET', path: reads[n % reads.length], headers: { cookie } };
                return { ...req, method: 'POST', path: '/api/answers', headers: { 'content-type': 'application/json', cookie }, body };
              },
              onResponse: (status: number, body: string) => {
                // Only a save answers 201 (a failed one is counted in non2xx); it names the new answer.
                if (status !== 201) return;
                const id = /^\{"id":"([^"]+)"/.exec(body)?.[1];
                if (id && body.includes(`"url":"/answers/${id}"`)) saved.push(id);
                else saveFailures++;
              },
            },
          ],
        } as never) as unknown as Promise<{ errors: number; timeouts: number; non2xx: number; requests: { total: number } }>;
        return run.then((result) => ({ result, saved, saveFailures }));
      };

      const [onA, onB] = await Promise.all([traffic(A, 11), traffic(B, 23)]);
      for (const { result, saveFailures } of [onA, onB]) {
        expect(result.requests.total).toBeGreaterThan(0);
        expect({ errors: result.errors, timeouts: result.timeouts, non2xx: result.non2xx, saveFailures }).toEqual({
          errors: 0,
          timeouts: 0,
          non2xx: 0,
          saveFailures: 0,
        });
      }
      expect(onA.saved.length).toBeGreaterThan(0);
      expect(onB.saved.length).toBeGreaterThan(0);

      // Every answer saved through one process reads back through the other.
      const readBack = async (base: string, ids: string[]) => {
        const c = sameBrowserOn(member, base);
        const unreadable: string[] = [];
        const queue = [...ids];
        // Four readers at a time: ten minutes of saves are thousands of answers.
        const reader = async () => {
          for (let id = queue.shift(); id; id = queue.shift()) {
            const r = await c.get(`/api/answers/${id}`);
            await r.body?.cancel();
            if (r.status !== 200) unreadable.push(`${id}: ${r.status}`);
          }
        };
        await Promise.all([reader(), reader(), reader(), reader()]);
        return unreadable;
      };
      expect(await readBack(B, onA.saved)).toEqual([]);
      expect(await readBack(A, onB.saved)).toEqual([]);
    },
    (SECONDS * 1.5 + 180) * 1000,
  );
});
