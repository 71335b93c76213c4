import type { Term } from './types';

// Every trade term an answer may use, in plain words. The engine attaches the ones its answer
// text actually contains, so a member can tap any of them.
const GLOSSARY: { term: string; match: RegExp; definition: string }[] = [
  { term: 'candle', match: /\bcandles?\b/i, definition: 'A pine’s new spring shoot while it is still a pale, soft spike, before its needles spread out.' },
  {
    term: 'pinch',
    match: /\bpinch/i,
    definition: 'To snap off part of a soft new shoot between finger and thumb (or with fine scissors), leaving the rest to grow.',
  },
  {
    term: 'decandle',
    match: /\bdecandl/i,
    definition: 'To cut this year’s spring candles off at their base on a strong pine that can push a second, shorter flush of shoots afterwards.',
  },
  {
    term: 'flush',
    match: /\bflush/i,
    definition:
      'One burst of new shoot growth. Most pines push one flush a season; some push a second after their candles are cut, and a few push several on their own.',
  },
  { term: 'silhouette', match: /\bsilhouette/i, definition: 'The outline of the tree’s foliage, as you want it to look; shoots beyond it spoil the shape.' },
  {
    term: 'refinement',
    match: /\brefinement\b/i,
    definition: 'The stage when the primary, secondary and tertiary branches are in place and the work is keeping the shape and evening out strength.',
  },
  { term: 'development', match: /\bdevelopment\b/i, definition: 'The stage when branches and strength are still being built, so shoots are mostly let grow.' },
  {
    term: 'back bud',
    match: /\bback[- ]?bud/i,
    definition: 'A new bud that appears on older wood behind the tip of a branch, which lets the branch be shortened later.',
  },
  {
    term: 'needle bundle',
    match: /\b(needle bundles?|bundles?\b|fascicle)/i,
    definition:
      'On a pine, needles grow in little groups held together at the base by a papery sheath; each group is a bundle (fascicle). Two-needle pines have pairs, others three or five.',
  },
  { term: 'needle pair', match: /\bneedle pairs?\b/i, definition: 'The bundle of two needles of a two-needle pine.' },
  {
    term: 'whorl',
    match: /\bwhorl/i,
    definition:
      'A ring of buds or branches at one point of a shoot. Some pines carry several whorls along one year’s shoot; a cut just above one leaves those buds to grow.',
  },
  {
    term: 'hardened',
    match: /\bharden/i,
    definition: 'The new needles have reached full size and turned firm and dark; the shoot has stopped extending for the year.',
  },
  { term: 'ramification', match: /\bramification/i, definition: 'Finer and finer branching: many short twigs dividing from each branch.' },
  { term: 'pad', match: /\bpads?\b/i, definition: 'A flattened cloud of foliage at the end of a branch.' },
  {
    term: 'dead zone',
    match: /\bbare (inner|interior)|brown interior|no green/i,
    definition: 'The leafless inner part of a juniper or cypress branch; cut back into it and it usually will not grow again.',
  },
  {
    term: 'lateral bud',
    match: /\b(side|lateral) bud/i,
    definition: 'A bud along the side of a shoot, not at its tip. Cutting just above one makes it the new tip.',
  },
  {
    term: 'recovery',
    match: /\brecovery\b/i,
    definition: 'A tree that is weak or was recently dug up: the work is rebuilding roots and strength, not shaping.',
  },
  { term: 'interior shoot', match: /\binterior\b/i, definition: 'A shoot inside the foliage mass, usually weaker for lack of light.' },
  {
    term: 'heat sum',
    match: /\b(heat sum|degree days?)\b/i,
    definition: 'The warmth collected so far this season: each day adds how far its average temperature was above +5 °C.',
  },
];

/** The terms whose words occur in any of the texts, in glossary order, each once. */
export function termsIn(texts: string[]): Term[] {
  const all = texts.join('\n');
  return GLOSSARY.filter((g) => g.match.test(all)).map(({ term, definition }) => ({ term, definition }));
}

export interface TextPart {
  text: string;
  /** The glossary term these words stand for, when they are one. */
  term?: string;
}

/**
 * The text cut into plain words and the glossary terms it uses (only those in `terms`), so each
 * term can be tapped for its meaning. At one place the longest match wins ("needle pairs" over "needle").
 */
export function splitTerms(text: string, terms: string[]): TextPart[] {
  const wanted = GLOSSARY.filter((g) => terms.includes(g.term)).map((g) => ({ term: g.term, re: new RegExp(g.match.source, 'gi') }));
  const parts: TextPart[] = [];
  let at = 0;
  while (at < text.length) {
    let best: { index: number; length: number; term: string } | null = null;
    for (const w of wanted) {
      w.re.lastIndex = at;
      const m = w.re.exec(text);
      if (!m || m[0].length === 0) continue;
      if (!best || m.index < best.index || (m.index === best.index && m[0].length > best.length)) best = { index: m.index, length: m[0].length, term: w.term };
    }
    if (!best) break;
    if (best.index > at) parts.push({ text: text.slice(at, best.index) });
    parts.push({ text: text.slice(best.index, best.index + best.length), term: best.term });
    at = best.index + best.length;
  }
  if (at < text.length) parts.push({ text: text.slice(at) });
  return parts;
}
