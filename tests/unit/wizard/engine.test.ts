import { describe, expect, it } from 'vitest';
import { evaluate, isOutOfSeason, stageOf, WizardInputError } from '@/lib/wizard/engine';
import { ENGINE_VERSION, RULES } from '@/lib/wizard/rules';
import { parseIsoDate, seasonOf } from '@/lib/wizard/season';
import { techniqueOf } from '@/lib/wizard/groups';
import { branchingLevels, type WizardContext, type WizardInput } from '@/lib/wizard/types';
import { shipped } from '../../support/shipped-species';

// Engine v2 on the shipped species files. Trade rules that no publication states are marked
// common practice; published values name the publication beside the check.
const north: WizardContext = { hemisphere: 'north', latitude: 45, today: '2027-05-10' };
const scots = shipped('pinus-sylvestris');
const blackPine = shipped('pinus-thunbergii');
const whitePine = shipped('pinus-parviflora');
const bristlecone = shipped('pinus-longaeva');
const ponderosa = shipped('pinus-ponderosa');
const mugo = shipped('pinus-mugo');
const lodgepole = shipped('pinus-contorta');
const juniper = shipped('juniperus-chinensis');
const hinoki = shipped('chamaecyparis-obtusa');
const larch = shipped('larix-decidua');
const spruce = shipped('picea-abies');
const yew = shipped('taxus-baccata');

function ask(over: Partial<WizardInput> = {}): WizardInput {
  return {
    species: 'pinus-sylvestris',
    branching: 'tertiary',
    date: '2027-05-10',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'average',
    ...over,
  };
}
const run = (over: Partial<WizardInput>, sp = scots, ctx = north) => evaluate(ask({ species: sp.slug, ...over }), sp, ctx);
const ruleIds = (r: ReturnType<typeof evaluate>) => r.reasons.map((x) => x.rule);
const allText = (r: ReturnType<typeof evaluate>) => [r.headline, ...r.howTo, ...r.watch, ...r.reasons.map((x) => x.text)].join(' ');

describe('engine version', () => {
  it('is 2.0.0', () => expect(ENGINE_VERSION).toBe('2.0.0'));
});

describe('stage', () => {
  // common practice, no published source
  it('refinement needs tertiary branching; a weak or recently collected tree is in recovery', () => {
    expect(stageOf({ branching: 'tertiary', health: 'average' })).toBe('refinement');
    expect(stageOf({ branching: 'secondary', health: 'strong' })).toBe('development');
    for (const b of branchingLevels) {
      expect(stageOf({ branching: b, health: 'weak' })).toBe('recovery');
      expect(stageOf({ branching: b, health: 'strong', recentlyCollected: true })).toBe('recovery');
    }
  });
});

describe('defect 1: collected and weak trees are not fed heavily', () => {
  it('a strong tree collected this season gets no pellets until new roots and shoots show', () => {
    // source: University of Maryland Extension, "After planting care" — fertiliser does not help while roots establish
    const r = run({ recentlyCollected: true, health: 'strong', branching: 'primary', container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 } });
    expect(r.stage).toBe('recovery');
    expect(r.fertilizer.feedNow).toBe(false);
    expect(r.fertilizer.piles).toBeNull();
    expect(r.fertilizer.pelletsPerPile).toBeNull();
    expect(r.fertilizer.foliar).toBe(false);
    expect(r.fertilizer.resumeWhen).toMatch(/new roots/);
    expect(r.fertilizer.reasons[0].source).toMatch(/University of Maryland Extension/);
  });
  it('a weak tree is fed lightly: fewer and smaller piles than refinement', () => {
    // common practice, no published source: a weak tree is fed lightly
    const pot = { shape: 'rectangle' as const, lengthCm: 40, widthCm: 30 };
    const weak = run({ health: 'weak', container: pot });
    const refined = run({ health: 'strong', container: pot });
    expect(weak.fertilizer.pelletsPerPile!.max).toBeLessThan(refined.fertilizer.pelletsPerPile!.min);
    expect(weak.fertilizer.piles!).toBeLessThanOrEqual(refined.fertilizer.piles!);
    expect(weak.fertilizer.foliar).toBe(false);
  });
});

describe('defect 2: decandling waits for finished candles, a healthy unrepotted tree and the local season', () => {
  const bp = (over: Partial<WizardInput>, ctx: WizardContext = north) => run({ health: 'strong', ...over }, blackPine, ctx);
  it('does not decandle on 1 June at 45°N while the candles are still extending', () => {
    // common practice, no published source: candles are cut once they have finished extending
    const r = bp({ date: '2027-06-01', shoot: 'candle-extending' });
    expect(r.action).not.toBe('decandle');
    expect(ruleIds(r)).toContain('flush.double-wait-candles-extending');
  });
  it('decandles once the needles open, inside the window', () => {
    expect(bp({ date: '2027-06-20', shoot: 'needles-opening' }).action).toBe('decandle');
    expect(bp({ date: '2027-06-20', shoot: 'needles-hardened' }).action).toBe('decandle');
  });
  it('never at 60°N, where the season is too short for a second flush (our own rule)', () => {
    const r = bp({ date: '2027-06-25', shoot: 'needles-opening', latitude: 60, hemisphere: 'north' });
    expect(r.action).not.toBe('decandle');
    expect(ruleIds(r)).toContain('flush.double-no-window');
  });
  it('still decandles at 30°N in mid-July, the warm-climate window (our own rule)', () => {
    expect(bp({ date: '2027-07-15', shoot: 'needles-hardened', latitude: 30, hemisphere: 'north' }).action).toBe('decandle');
    // …but not yet on 20 June there: the window opens later in a warm climate.
    const early = bp({ date: '2027-06-20', shoot: 'needles-opening', latitude: 30, hemisphere: 'north' });
    expect(early.action).toBe('wait');
    expect(ruleIds(early)).toContain('flush.double-window-not-yet');
  });
  it('the club setting moves the window', () => {
    const late = { ...north, decandleOffsetDays: 20 };
    expect(bp({ date: '2027-06-05', shoot: 'needles-opening' }, north).action).toBe('decandle');
    expect(bp({ date: '2027-06-05', shoot: 'needles-opening' }, late).action).toBe('wait');
  });
  it('a tree repotted this year is not decandled', () => {
    // common practice, no published source: no repotting and candle cutting in one year
    const r = bp({ date: '2027-06-20', shoot: 'needles-opening', repottedThisYear: true });
    expect(r.action).not.toBe('decandle');
    expect(ruleIds(r)).toContain('flush.no-decandle-repotted');
  });
  it('a low heat sum holds the cut back even inside the window', () => {
    expect(bp({ date: '2027-06-20', shoot: 'needles-opening', degreeDays: 200 }).action).toBe('wait');
    expect(bp({ date: '2027-06-20', shoot: 'needles-opening', degreeDays: 700 }).action).toBe('decandle');
  });
});

describe('defect 3: the reduction is a fraction scaled by strength; bundles by the species’ own count', () => {
  it('strong candles keep a third to a half, average ones more, weak ones are left whole', () => {
    // source: University of Wisconsin Plant Disease Diagnostics Clinic, "How to properly prune evergreens" (2015): remove half to two-thirds
    const strong = run({ candleStrength: 'strong' });
    expect(strong.action).toBe('pinch');
    expect(strong.candleKeep).toEqual({ min: 0.33, max: 0.5 });
    expect(strong.headline).toMatch(/keep about a third to a half of this candle/);
    const average = run({ candleStrength: 'average' });
    expect(average.candleKeep!.min).toBeGreaterThan(strong.candleKeep!.min);
    const weak = run({ candleStrength: 'weak' });
    expect(weak.action).toBe('let-grow');
    expect(weak.candleKeep).toBeNull();
  });
  it('never counts needle pairs on a soft candle', () => {
    const r = run({ candleStrength: 'strong' });
    expect(r.keepNeedlePairs).toBeNull();
    expect(allText(r)).not.toMatch(/pairs? of needles|needle pairs/);
  });
  it('hardened shoots cut in autumn keep needle bundles in the species’ own count', () => {
    const two = run({ date: '2027-10-01', shoot: 'needles-hardened', candleStrength: 'strong' });
    expect(two.action).toBe('prune');
    expect(two.keepNeedleBundles).toBe(2);
    expect(two.keepNeedlePairs).toBe(2);
    expect(two.headline).toMatch(/2 needle pairs/);
    const three = run({ date: '2027-10-01', shoot: 'needles-hardened', candleStrength: 'strong' }, ponderosa);
    expect(three.keepNeedleBundles).toBe(2);
    expect(three.keepNeedlePairs).toBeNull();
    expect(three.headline).toMatch(/three needles each/);
    expect(allText(three)).not.toMatch(/needle pairs?/);
  });
});

describe('defect 4: each group gets its own technique', () => {
  it('junipers and cypresses are trimmed to a fork with scissors, never pinched by fingers or told of candles', () => {
    // source: The Morton Arboretum, "Pruning evergreens" (branch by branch, not shearing); Wisconsin Horticulture (no refill of a bare interior)
    for (const sp of [juniper, hinoki]) {
      const r = run({ date: '2027-05-20', shoot: 'candle-extending' }, sp);
      expect(r.action).toBe('prune');
      expect(r.howTo.join(' ')).toMatch(/scissors/);
      expect(r.howTo.join(' ')).toMatch(/do not pull the soft tips off with your fingers/i);
      expect(allText(r)).not.toMatch(/\bcandles?\b/i);
      expect(r.candleKeep).toBeNull();
    }
  });
  it('larch is never promised elongations and has no needles to count', () => {
    // common practice, no published source (no publication on larch pruning was found)
    const spring = run({ shoot: 'candle-extending' }, larch);
    expect(spring.action).toBe('let-grow');
    const summer = run({ date: '2027-07-10', shoot: 'needles-hardened' }, larch);
    expect(summer.action).toBe('prune');
    for (const r of [spring, summer]) {
      expect(allText(r)).not.toMatch(/elongation|needle pair|bundle|\bcandle/i);
      expect(r.keepNeedleBundles).toBeNull();
    }
  });
  it('spruce shortens extending shoots and cuts hardened ones to a side bud', () => {
    // source: University of Wisconsin Plant Disease Diagnostics Clinic (2015): cut spruce back to a lateral bud
    const r = run({ shoot: 'candle-extending', candleStrength: 'strong' }, spruce);
    expect(r.action).toBe('pinch');
    expect(allText(r)).not.toMatch(/\bcandle/i);
    const autumn = run({ date: '2027-09-25', shoot: 'needles-hardened' }, spruce);
    expect(autumn.action).toBe('prune');
    expect(autumn.reasons.find((x) => x.rule === 'spruce.cut-to-side-bud')!.source).toMatch(/Wisconsin/);
  });
  it('yew is trimmed once new growth is out, citing its regrowth from old wood', () => {
    // source: NYBG Plant Information Service, "Can an overgrown yew bush be revived?" (2021)
    const r = run({ date: '2027-06-10', shoot: 'needles-hardened' }, yew);
    expect(r.action).toBe('prune');
    expect(r.reasons.find((x) => x.rule === 'yew.trim-new-growth')!.source).toMatch(/NYBG/);
  });
  it('multinodal pines are cut back to a whorl', () => {
    // common practice, no published source
    const r = run({ candleStrength: 'strong' }, lodgepole);
    expect(techniqueOf(lodgepole)).toBe('pine-multinodal');
    expect(r.action).toBe('pinch');
    expect(r.howTo.join(' ')).toMatch(/whorl/);
  });
  it('a species group without a sound rule says so plainly', () => {
    const other = { ...scots, slug: 'ginkgo-biloba', group: 'other' as const, needlesPerFascicle: null };
    const r = run({}, other);
    expect(r.action).toBe('wait');
    expect(ruleIds(r)).toContain('scope.no-rule');
  });
});

describe('defect 5: autumn work', () => {
  // common practice, no published source: autumn bud selection and needle thinning
  it('single-flush pines: cut hardened shoots beyond the outline; thin those at the outline', () => {
    expect(run({ date: '2027-10-05', shoot: 'needles-hardened', candleStrength: 'strong' }).action).toBe('prune');
    const thin = run({ date: '2027-10-05', shoot: 'needles-hardened', position: 'at-silhouette' });
    expect(thin.action).toBe('thin');
    expect(thin.howTo.join(' ')).toMatch(/keep two/);
  });
  it('double-flush pines: reduce new buds to two per tip and pull old needles in strong areas', () => {
    const r = run({ date: '2027-10-05', shoot: 'needles-hardened', health: 'strong' }, blackPine);
    expect(r.action).toBe('thin');
    expect(ruleIds(r)).toContain('pine.double-autumn-thin');
    expect(r.howTo.join(' ')).toMatch(/keep two/);
  });
});

describe('defect 6: black pine gets double-flush wording', () => {
  it('in autumn it is not told to pinch next spring', () => {
    const r = run({ date: '2027-10-05', shoot: 'needles-hardened', health: 'strong' }, blackPine);
    expect(allText(r)).not.toMatch(/pinch this candle/i);
  });
  it('an average-health tree is not told to pinch: it skips decandling or cuts only the strongest areas', () => {
    // common practice, no published source
    const weakCandle = run({ date: '2027-06-20', shoot: 'needles-opening', health: 'average', candleStrength: 'average' }, blackPine);
    expect(weakCandle.action).toBe('let-grow');
    const strongCandle = run({ date: '2027-06-20', shoot: 'needles-opening', health: 'average', candleStrength: 'strong' }, blackPine);
    expect(strongCandle.action).toBe('decandle');
    expect(ruleIds(strongCandle)).toContain('flush.double-average-strongest-only');
    expect(strongCandle.cautions.map((c) => c.text).join(' ')).toMatch(/strongest areas/);
    const extending = run({ shoot: 'candle-extending', health: 'average' }, blackPine);
    expect(extending.action).not.toBe('pinch');
  });
});

describe('defect 7: successive elongations only where they hold', () => {
  // common practice, no published source: vigorous, well-fed two-needle pines pinched early
  it('appears for a strong Scots pine in spring and explains it is not a second flush', () => {
    const r = run({ health: 'strong', candleStrength: 'strong' });
    expect(ruleIds(r)).toContain('pine.successive-elongations');
    expect(r.reasons.find((x) => x.rule === 'pine.successive-elongations')!.text).toMatch(/not a second flush/);
  });
  it('never for five-needle pines or bristlecones, nor in autumn', () => {
    for (const sp of [whitePine, bristlecone])
      expect(ruleIds(run({ health: 'strong', candleStrength: 'strong' }, sp))).not.toContain('pine.successive-elongations');
    expect(ruleIds(run({ health: 'strong', date: '2027-10-05', shoot: 'candle-extending' }))).not.toContain('pine.successive-elongations');
  });
});

describe('defect 8: feeding agrees with itself', () => {
  it('mugo feeding follows the needles, not the calendar', () => {
    // common practice, no published source: mugo's needles lengthen strongly with feeding
    const may = run({ date: '2027-05-25', shoot: 'candle-extending' }, mugo);
    const june = run({ date: '2027-06-01', shoot: 'candle-extending' }, mugo);
    expect(may.fertilizer.feedNow).toBe(false);
    expect(june.fertilizer.feedNow).toBe(false);
    expect(run({ date: '2027-06-20', shoot: 'needles-hardened' }, mugo).fertilizer.feedNow).toBe(true);
  });
  it('light feeders get lighter plans than Scots pine', () => {
    const pot = { shape: 'rectangle' as const, lengthCm: 40, widthCm: 30 };
    for (const sp of [whitePine, bristlecone]) {
      const p = run({ container: pot }, sp).fertilizer;
      expect(p.pelletsPerPile!.max).toBeLessThan(run({ container: pot }).fertilizer.pelletsPerPile!.min);
    }
  });
  it('black pine eases off while the second flush extends', () => {
    const r = run({ date: '2027-06-20', shoot: 'needles-opening', health: 'strong' }, blackPine);
    expect(r.action).toBe('decandle');
    expect(r.fertilizer.feedNow).toBe(false);
    expect(ruleIds({ ...r, reasons: r.fertilizer.reasons })).toContain('feed.ease-second-flush');
  });
  it('a 10 cm pot keeps the reference density of pellets per cm² (within a pellet)', () => {
    const small = run({ container: { shape: 'round', lengthCm: 10 } }).fertilizer;
    const ref = run({ container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 } }).fertilizer;
    const density = (p: typeof small) => (p.piles! * (p.pelletsPerPile!.min + p.pelletsPerPile!.max)) / 2 / p.surfaceCm2!;
    expect(density(small)).toBeLessThan(density(ref) * 1.5 + 1 / small.surfaceCm2!);
  });
  it('gives pellet size and how often piles are renewed', () => {
    const p = run({}).fertilizer;
    expect(p.pelletSize).toMatch(/cm/);
    expect(p.renewWeeks).toEqual({ min: 4, max: 6 });
  });
});

describe('defect 9: season and latitude', () => {
  it('refuses a northern hemisphere with a southern latitude, naming both fields', () => {
    try {
      run({ hemisphere: 'north', latitude: -35 });
      throw new Error('accepted');
    } catch (e) {
      expect(e).toBeInstanceOf(WizardInputError);
      expect(Object.keys((e as WizardInputError).fields).sort()).toEqual(['hemisphere', 'latitude']);
    }
  });
  it('within the tropics it says calendar seasons do not apply and follows the shoot state', () => {
    const r = run({ latitude: 15, hemisphere: 'north', date: '2027-01-10', shoot: 'candle-extending', candleStrength: 'strong' });
    expect(ruleIds(r)).toContain('season.tropics');
    expect(r.action).toBe('pinch');
    expect(r.cautions.some((c) => /unusual/.test(c.text))).toBe(false);
  });
  it('candles extending in autumn get the out-of-season caution', () => {
    const s = seasonOf(parseIsoDate('2027-11-20')!, 'north');
    expect(isOutOfSeason('candle-extending', s)).toBe(true);
    const r = run({ date: '2027-09-10', shoot: 'candle-extending' });
    expect(r.cautions.some((c) => /unusual/.test(c.text))).toBe(true);
  });
  it('the southern hemisphere reads the same date six months on', () => {
    // common practice, no published source
    const south = run({ date: '2027-11-10', hemisphere: 'south', latitude: -37.8, candleStrength: 'strong' });
    expect(south.season).toBe('spring');
    expect(south.action).toBe('pinch');
  });
});

describe('defect 10: no duplicated cautions, one wording for the two-year rule', () => {
  it('shows the wild-collecting caution once even when the species carries one too', () => {
    const sp = {
      ...scots,
      cautions: [...scots.cautions, { text: 'Collecting from the wild needs permission from the landowner.', source: 'common practice' }],
    };
    const r = run({ recentlyCollected: true }, sp);
    expect(r.cautions.filter((c) => /collecting from the wild/i.test(c.text))).toHaveLength(1);
    const texts = r.cautions.map((c) => c.text);
    expect(new Set(texts).size).toBe(texts.length);
  });
  it('says "about two years", never "two seasons"', () => {
    const all = Object.values(RULES)
      .map((r) => r.text)
      .join(' ');
    expect(all).not.toMatch(/two seasons/);
    expect(RULES['stage.recovery-collected'].text).toMatch(/about two years/);
  });
});

describe('how-to and terms', () => {
  it('every acting answer has steps, and every trade word used is explained', () => {
    for (const [over, sp] of [
      [{ candleStrength: 'strong' }, scots],
      [{ date: '2027-06-20', shoot: 'needles-opening', health: 'strong' }, blackPine],
      [{ date: '2027-10-05', shoot: 'needles-hardened' }, scots],
    ] as const) {
      const r = run(over as Partial<WizardInput>, sp);
      expect(r.howTo.length).toBeGreaterThan(1);
      const text = allText(r);
      for (const [word, term] of [
        ['candle', 'candle'],
        ['silhouette', 'silhouette'],
        ['refinement', 'refinement'],
      ]) {
        if (new RegExp(`\\b${word}`, 'i').test(text)) expect(r.terms.map((t) => t.term)).toContain(term);
      }
    }
  });
  it('reasons use plain words, not figurative phrasing', () => {
    const all = Object.values(RULES)
      .map((r) => r.text)
      .join(' ');
    expect(all).not.toMatch(/traffic|very surface|elongating cylinder/);
  });
});
