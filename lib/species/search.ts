// Species search, shared by the server list API (`GET /api/species?q=`), the /species table's
// results as you type and the wizard's picker, so all of them rank the same way.
//
// Names are compared word by word, so word order does not matter ("black pine japanese"), a word
// may be the start of a name word ("jap bla"), and a word may be misspelt by one letter (two in
// long words: "sylvestrus", "pnus"). A trigram index over the words of every name hands the
// spelling check a short list, so a query does not touch every name. The score is a pure function
// of the query and one species (never of the others), which keeps server-side keyset paging
// stable across requests and gives the browser exactly the server's order.

export interface SearchableSpecies {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
}

type NameKind = 'botanical' | 'common' | 'synonym';

/** Which of a species' names the query matched, and how. */
export interface SearchMatch {
  text: string;
  kind: NameKind;
  /** The species' own first name of that kind (botanical, or first common name): not worth saying. */
  primary: boolean;
  /** At least one word was matched by a close spelling, not as written. */
  misspelt: boolean;
}

export interface SearchHit<T> {
  item: T;
  /** Lower is better. An integer, so it is the same in every JavaScript engine and in a cursor. */
  score: number;
  match: SearchMatch;
}

const MAX_QUERY_WORDS = 8;

/** Lower case, accents dropped, everything but letters and digits a space. */
function normalizeText(s: string): string {
  return s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

export function queryWords(q: string): string[] {
  const words = normalizeText(q).split(' ').filter(Boolean);
  return [...new Set(words)].slice(0, MAX_QUERY_WORDS);
}

/** Edits a word of this length may carry and still count as the same word. */
function allowedEdits(length: number): number {
  return length <= 3 ? 0 : length <= 6 ? 1 : 2;
}

/** Optimal string alignment distance (a swap of neighbours is one edit), or max + 1 once it is over. */
export function editDistance(a: string, b: string, max: number): number {
  if (Math.abs(a.length - b.length) > max) return max + 1;
  const n = b.length;
  let prev2 = new Array<number>(n + 1).fill(0);
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  let cur = new Array<number>(n + 1).fill(0);
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    let rowMin = cur[0];
    for (let j = 1; j <= n; j++) {
      const cost = a.charCodeAt(i - 1) === b.charCodeAt(j - 1) ? 0 : 1;
      let v = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && a.charCodeAt(i - 1) === b.charCodeAt(j - 2) && a.charCodeAt(i - 2) === b.charCodeAt(j - 1)) v = Math.min(v, prev2[j - 2] + 1);
      cur[j] = v;
      if (v < rowMin) rowMin = v;
    }
    if (rowMin > max) return max + 1;
    [prev2, prev, cur] = [prev, cur, prev2];
  }
  return prev[n];
}

/** Trigrams of a word padded like PostgreSQL's pg_trgm: two spaces before, one after. */
function trigrams(word: string): string[] {
  const padded = `  ${word} `;
  const out = new Set<string>();
  for (let i = 0; i + 3 <= padded.length; i++) out.add(padded.slice(i, i + 3));
  return [...out];
}

interface NameEntry {
  species: number;
  text: string;
  kind: NameKind;
  primary: boolean;
  words: number;
}

/** Where a vocabulary word occurs: name entry and word position. */
type Posting = { name: number; pos: number };

export interface SpeciesSearchIndex<T extends SearchableSpecies> {
  items: T[];
  names: NameEntry[];
  /** Every distinct word of every name, sorted (prefix look-ups are a binary search). */
  vocab: string[];
  postings: Posting[][];
  byWord: Map<string, number>;
  byTrigram: Map<string, number[]>;
  /** Scratch space for one search at a time (searches are synchronous), reused to spare the collector. */
  scratch: { shared: Int32Array; cost: Int8Array; met: Int32Array; genus: Uint8Array; seen: Uint8Array };
}

export function buildSpeciesIndex<T extends SearchableSpecies>(items: T[]): SpeciesSearchIndex<T> {
  const names: NameEntry[] = [];
  const wordsOf: string[][] = [];
  items.forEach((item, species) => {
    const add = (text: string, kind: NameKind, primary: boolean) => {
      const words = normalizeText(text).split(' ').filter(Boolean);
      if (!words.length) return;
      names.push({ species, text, kind, primary, words: words.length });
      wordsOf.push(words);
    };
    add(item.botanicalName, 'botanical', true);
    item.commonNames.forEach((c, i) => add(c, 'common', i === 0));
    item.synonyms.forEach((s) => add(s, 'synonym', false));
  });
  const vocab = [...new Set(wordsOf.flat())].sort();
  const byWord = new Map(vocab.map((w, i) => [w, i]));
  const postings: Posting[][] = vocab.map(() => []);
  wordsOf.forEach((words, name) => words.forEach((w, pos) => postings[byWord.get(w)!].push({ name, pos })));
  const byTrigram = new Map<string, number[]>();
  vocab.forEach((w, i) => {
    for (const t of trigrams(w)) {
      const list = byTrigram.get(t);
      if (list) list.push(i);
      else byTrigram.set(t, [i]);
    }
  });
  const scratch = {
    shared: new Int32Array(vocab.length),
    cost: new Int8Array(names.length * MAX_QUERY_WORDS),
    met: new Int32Array(names.length),
    genus: new Uint8Array(names.length),
    seen: new Uint8Array(names.length),
  };
  return { items, names, vocab, postings, byWord, byTrigram, scratch };
}

// How a query word met a name word; lower is better.
const EXACT = 0;
const PREFIX = 1;

/** Vocabulary words a query word matches, with a cost: 0 exact, 1 start of the word, 2 + edits spelt close. */
function wordMatches(index: SpeciesSearchIndex<SearchableSpecies>, q: string): Map<number, number> {
  const out = new Map<number, number>();
  const exact = index.byWord.get(q);
  if (exact !== undefined) out.set(exact, EXACT);
  if (q.length >= 2) {
    let lo = 0;
    let hi = index.vocab.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (index.vocab[mid] < q) lo = mid + 1;
      else hi = mid;
    }
    for (let i = lo; i < index.vocab.length && index.vocab[i].startsWith(q); i++) if (!out.has(i)) out.set(i, PREFIX);
  }
  const max = allowedEdits(q.length);
  if (max === 0) return out;
  // A word within `max` edits keeps all but 3 × max of the query's trigrams (a prefix all but one more).
  const grams = trigrams(q);
  const need = Math.max(1, grams.length - 1 - 3 * max);
  const shared = index.scratch.shared;
  const touched: number[] = [];
  for (const g of grams) {
    for (const w of index.byTrigram.get(g) ?? []) if (shared[w]++ === 0) touched.push(w);
  }
  for (const w of touched) {
    const count = shared[w];
    shared[w] = 0;
    if (count < need || out.has(w)) continue;
    const word = index.vocab[w];
    const whole = editDistance(q, word, max);
    if (whole <= max) {
      out.set(w, 2 + whole);
      continue;
    }
    // The start of a longer word, misspelt ("lodgpol" for lodgepole): one edit at most.
    if (q.length >= 5 && word.length > q.length) {
      let best = 2;
      for (const len of [q.length - 1, q.length, q.length + 1]) best = Math.min(best, editDistance(q, word.slice(0, len), 1));
      if (best <= 1) out.set(w, 3 + best);
    }
  }
  return out;
}

/**
 * Order key of one name against the query, lower is better: query words the name lacks, then
 * spelling edits, then words matched only by their start, then whether a botanical name's genus
 * was asked for ("abies" puts the firs before Picea abies), then name words the query did not ask
 * for ("red pine" before "Japanese red pine"), then botanical / common name / synonym.
 */
function nameScore(missing: number, edits: number, partial: number, genusMiss: boolean, unasked: number, kind: NameKind, primary: boolean) {
  const kindRank = kind === 'botanical' ? 0 : kind === 'common' ? (primary ? 1 : 2) : 3;
  return (
    missing * 100_000_000 + Math.min(edits, 99) * 1_000_000 + Math.min(partial, 9) * 100_000 + (genusMiss ? 10_000 : 0) + Math.min(unasked, 99) * 100 + kindRank
  );
}

/** Compare two hits: score, then botanical name and slug by code unit (the same in every locale). */
export function compareHits(a: { score: number; item: SearchableSpecies }, b: { score: number; item: SearchableSpecies }) {
  return a.score - b.score || cmp(a.item.botanicalName, b.item.botanicalName) || cmp(a.item.slug, b.item.slug);
}

export const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** Best match first; every species that matches at least one query word. An empty query lists all in name order. */
export function searchSpecies<T extends SearchableSpecies>(items: T[], q: string, index: SpeciesSearchIndex<T> = buildSpeciesIndex(items)): SearchHit<T>[] {
  const words = queryWords(q);
  if (!words.length) {
    return index.items
      .map((item) => ({ item, score: 0, match: { text: item.botanicalName, kind: 'botanical' as const, primary: true, misspelt: false } }))
      .sort(compareHits);
  }
  // Per name: for each query word, its best cost (-1 none); which name words were met (a bit mask);
  // whether a botanical name's genus was. Kept in the index's scratch arrays, cleared after use.
  const { cost, met, genus, seen } = index.scratch;
  const W = words.length;
  const touched: number[] = [];
  words.forEach((word, qi) => {
    for (const [w, c] of wordMatches(index as SpeciesSearchIndex<SearchableSpecies>, word)) {
      for (const { name, pos } of index.postings[w]) {
        if (!seen[name]) {
          seen[name] = 1;
          touched.push(name);
          cost.fill(-1, name * W, name * W + W);
        }
        const at = name * W + qi;
        if (cost[at] === -1 || c < cost[at]) cost[at] = c;
        if (pos < 31) met[name] |= 1 << pos;
        if (pos === 0 && c <= PREFIX && index.names[name].kind === 'botanical') genus[name] = 1;
      }
    }
  });
  const best = new Map<number, SearchHit<T>>();
  for (const n of touched) {
    const entry = index.names[n];
    let missing = 0;
    let edits = 0;
    let partial = 0;
    for (let qi = 0; qi < W; qi++) {
      const c = cost[n * W + qi];
      if (c === -1) missing++;
      else if (c === PREFIX) partial++;
      else if (c >= 2) edits += c - 1; // 2 + d whole word → d + 1; a misspelt start → d + 2
    }
    let metCount = 0;
    for (let m = met[n]; m; m &= m - 1) metCount++;
    const score = nameScore(missing, edits, partial, !genus[n], entry.words - metCount, entry.kind, entry.primary);
    seen[n] = 0;
    met[n] = 0;
    genus[n] = 0;
    const prev = best.get(entry.species);
    if (!prev || score < prev.score) {
      best.set(entry.species, {
        item: index.items[entry.species],
        score,
        match: { text: entry.text, kind: entry.kind, primary: entry.primary, misspelt: edits > 0 },
      });
    }
  }
  return [...best.values()].sort(compareHits);
}

/** What to tell the reader about a hit, or null when it matched the name shown anyway. */
export function matchNote(match: SearchMatch): string | null {
  if (match.primary && !match.misspelt) return null;
  const what = match.kind === 'synonym' ? 'other name' : match.kind === 'common' ? 'common name' : 'botanical name';
  return match.misspelt ? `matched ${match.text} (${what}, spelt differently)` : `matched ${match.text} (${what})`;
}
