import Fuse, { type IFuseOptions } from 'fuse.js';
import { extra, log, percentile, record, round } from './lib';
import { optional } from './optional';

// fuse.js over generated species records (botanical name, common names, synonyms), with the
// options the app itself uses when lib/species/search.ts is present.

interface Rec {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
}

const syllables = ['al', 'ba', 'cor', 'den', 'el', 'fi', 'gra', 'hal', 'ir', 'ju', 'ka', 'lo', 'mu', 'nor', 'pa', 'qui', 'ra', 'sil', 'tu', 'ver', 'xan', 'yo', 'zel', 'ri', 'ca', 'na'];
const genera = ['Pinus', 'Picea', 'Abies', 'Larix', 'Juniperus', 'Cedrus', 'Tsuga', 'Taxus', 'Cryptomeria', 'Chamaecyparis', 'Sequoia', 'Thuja'];
const adjectives = ['black', 'red', 'white', 'mountain', 'coastal', 'dwarf', 'weeping', 'silver', 'blue', 'golden', 'river', 'stone', 'creeping', 'tall'];
const nouns = ['pine', 'spruce', 'fir', 'larch', 'juniper', 'cedar', 'hemlock', 'yew', 'cypress'];

function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function generateSpecies(n: number, seed = 1): Rec[] {
  const r = rng(seed);
  const pick = <T,>(a: T[]) => a[Math.floor(r() * a.length)];
  const word = (k: number) => Array.from({ length: k }, () => pick(syllables)).join('');
  const out: Rec[] = [];
  const seen = new Set<string>();
  while (out.length < n) {
    const botanicalName = `${pick(genera)} ${word(2 + Math.floor(r() * 2))}${pick(['a', 'ii', 'is', 'um', 'ensis'])}`;
    if (seen.has(botanicalName)) continue;
    seen.add(botanicalName);
    out.push({
      slug: botanicalName.toLowerCase().replace(/\s+/g, '-'),
      botanicalName,
      commonNames: Array.from({ length: 1 + Math.floor(r() * 3) }, () => `${pick(adjectives)} ${word(1)} ${pick(nouns)}`),
      synonyms: Array.from({ length: Math.floor(r() * 3) }, () => `${pick(genera)} ${word(3)}a`),
    });
  }
  return out;
}

/** A typo a grower makes: a dropped, doubled, swapped or wrong letter, maybe twice. */
function typo(s: string, r: () => number) {
  let t = s;
  for (let k = 0; k < 1 + (r() < 0.3 ? 1 : 0); k++) {
    const i = 1 + Math.floor(r() * Math.max(1, t.length - 2));
    const kind = Math.floor(r() * 4);
    if (kind === 0) t = t.slice(0, i) + t.slice(i + 1);
    else if (kind === 1) t = t.slice(0, i) + t[i] + t.slice(i);
    else if (kind === 2 && i + 1 < t.length) t = t.slice(0, i) + t[i + 1] + t[i] + t.slice(i + 2);
    else t = t.slice(0, i) + 'abcdefghijklmnopqrstuvwxyz'[Math.floor(r() * 26)] + t.slice(i + 1);
  }
  return t;
}

export function typoQueries(items: Rec[], n = 200, seed = 2) {
  const r = rng(seed);
  return Array.from({ length: n }, () => {
    const it = items[Math.floor(r() * items.length)];
    const source = r() < 0.5 ? it.botanicalName.split(' ')[1] : r() < 0.5 ? it.commonNames[0] : it.botanicalName;
    return typo(source, r);
  });
}

export async function benchSearch() {
  const section = 'search';
  const app = await optional<{ speciesFuseOptions: IFuseOptions<Rec> }>('lib/species/search');
  const options: IFuseOptions<Rec> = app
    ? app.speciesFuseOptions
    : { keys: ['botanicalName', 'commonNames', 'synonyms'], includeScore: true, ignoreLocation: true, threshold: 0.4 };
  extra.fuseOptions = app ? 'lib/species/search.ts speciesFuseOptions' : 'fallback: 3 keys, threshold 0.4 (lib/species/search.ts not in this build)';
  const results: Record<string, unknown> = {};
  for (const [n, target] of [[1_000, 5], [10_000, 30]] as const) {
    const items = generateSpecies(n);
    const queries = typoQueries(items);
    const builds: number[] = [];
    let index!: Fuse<Rec>;
    for (let i = 0; i < 5; i++) {
      const t0 = performance.now();
      index = new Fuse(items, options);
      builds.push(performance.now() - t0);
    }
    for (const q of queries.slice(0, 20)) index.search(q); // warm the JIT
    const times: number[] = [];
    const cpu: number[] = [];
    let hits = 0;
    for (const q of queries) {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      const res = index.search(q);
      times.push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu.push((c.user + c.system) / 1000);
      if (res.length) hits++;
    }
    const p95 = percentile(times, 95);
    const cpuP95 = percentile(cpu, 95);
    log(`fuse ${n}: build ${round(Math.min(...builds))} ms, p95 ${round(p95)} ms, ${hits}/${queries.length} queries found something`);
    record({ section, name: `fuse index build, ${n} species`, value: Math.min(...builds), unit: 'ms', pass: null, note: 'best of 5' });
    record({ section, name: `fuse p95 query, ${n} species`, value: p95, unit: 'ms', target: `≤ ${target} ms`, pass: p95 <= target, note: `200 typo queries, ${hits} with results; CPU-time p95 ${round(cpuP95)} ms` });
    results[n] = { buildMs: builds, p50: percentile(times, 50), p95, cpuP95, max: Math.max(...times), hits, sampleQueries: queries.slice(0, 10) };
  }
  extra.search = results;
}
