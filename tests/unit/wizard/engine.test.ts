import { describe, expect, it } from 'vitest';
import { evaluate, stageOf, isOutOfSeason } from '@/lib/wizard/engine';
import { ENGINE_VERSION, RULES } from '@/lib/wizard/rules';
import { parseIsoDate, seasonOf } from '@/lib/wizard/season';
import { dueNow } from '@/lib/wizard/due-now';
import { branchingLevels, healthLevels, positions, shootStates, type WizardInput } from '@/lib/wizard/types';
import { ask, blackPine, juniper, mugo, north, scots, southClub } from '../../support/wizard-fixtures';

const rules = (i: WizardInput, sp = scots, ctx = north) => evaluate(i, sp, ctx).reasons.map((r) => r.rule);

describe('stage', () => {
  // common practice, no published source
  it('refinement needs primary, secondary and tertiary branching', () => {
    expect(stageOf({ branching: 'tertiary', health: 'average' })).toBe('refinement');
    expect(stageOf({ branching: 'secondary', health: 'strong' })).toBe('development');
    expect(stageOf({ branching: 'primary', health: 'strong' })).toBe('development');
  });
  it('a recently collected or weak tree is in recovery, whatever its branching', () => {
    for (const b of branchingLevels) {
      expect(stageOf({ branching: b, health: 'weak' })).toBe('recovery');
      expect(stageOf({ branching: b, health: 'strong', recentlyCollected: true })).toBe('recovery');
    }
  });
  it('recovery lets the tree grow and says why', () => {
    // common practice, no published source: collected trees back-bud after about two years
    const r = evaluate(ask({ recentlyCollected: true, health: 'strong' }), scots, north);
    expect(r).toMatchObject({ stage: 'recovery', action: 'let-grow', keepNeedlePairs: null });
    expect(r.reasons.map((x) => x.rule)).toEqual(expect.arrayContaining(['stage.recovery-collected', 'recover.let-grow']));
    expect(r.reasons.find((x) => x.rule === 'stage.recovery-collected')!.text).toMatch(/two years/);
    const weak = evaluate(ask({ health: 'weak' }), scots, north);
    expect(weak).toMatchObject({ stage: 'recovery', action: 'let-grow' });
    expect(weak.reasons.map((x) => x.rule)).toContain('stage.recovery-weak');
  });
});

describe('refinement: pinching a single-flush pine', () => {
  it('pinches a soft candle beyond the silhouette and keeps at least two needle pairs', () => {
    // common practice, no published source
    const r = evaluate(ask(), scots, north);
    expect(r).toMatchObject({ action: 'pinch', stage: 'refinement', season: 'spring', keepNeedlePairs: 2 });
    expect(r.reasons.map((x) => x.rule)).toEqual(
      expect.arrayContaining(['stage.refinement', 'refine.pinch-soft-candle', 'refine.pinch-auxin', 'refine.keep-two-pairs-single-flush', 'flush.single-never-decandle']),
    );
    expect(r.headline).toMatch(/leave at least 2 pairs of needles/);
    expect(r.watch.join(' ')).toMatch(/two to three weeks/);
    // the deciding rules come before the asides
    expect(r.reasons.map((x) => x.rule).slice(0, 2)).toEqual(['stage.refinement', 'refine.pinch-soft-candle']);
    expect(r.reasons.at(-1)!.rule).toBe('flush.single-never-decandle');
  });

  it('is too late once the needles are opening', () => {
    // common practice, no published source: a pinch then can take the whole bud
    const r = evaluate(ask({ shoot: 'needles-opening' }), scots, north);
    expect(r.action).toBe('wait');
    expect(r.keepNeedlePairs).toBeNull();
    expect(r.reasons.find((x) => x.rule === 'refine.too-late-needles-open')!.text).toMatch(/whole bud/);
  });

  it('has nothing to pinch on a dormant bud or hardened needles', () => {
    // common practice, no published source
    expect(evaluate(ask({ shoot: 'dormant-bud', date: '2027-03-20' }), scots, north)).toMatchObject({ action: 'wait' });
    expect(rules(ask({ shoot: 'dormant-bud', date: '2027-03-20' }))).toContain('refine.bud-not-yet');
    expect(evaluate(ask({ shoot: 'needles-hardened', date: '2027-07-01' }), scots, north)).toMatchObject({ action: 'wait' });
    expect(rules(ask({ shoot: 'needles-hardened', date: '2027-07-01' }))).toContain('refine.hardened-nothing-to-pinch');
  });

  it('lets interior shoots grow and leaves shoots within the silhouette alone', () => {
    // common practice, no published source
    for (const shoot of ['candle-extending', 'needles-opening', 'needles-hardened'] as const) {
      const r = evaluate(ask({ position: 'interior', shoot, date: '2027-05-20' }), scots, north);
      expect(r.action).toBe('let-grow');
      expect(r.reasons.map((x) => x.rule)).toContain('refine.interior-let-grow');
    }
    const at = evaluate(ask({ position: 'at-silhouette' }), scots, north);
    expect(at.action).toBe('wait');
    expect(at.reasons.map((x) => x.rule)).toContain('refine.at-silhouette-nothing');
  });

  it('expects up to three elongations on a vigorous single-flush pine', () => {
    // common practice, no published source
    expect(rules(ask(), mugo)).toContain('refine.successive-elongations'); // vigour high
    expect(rules(ask({ health: 'strong' }), scots)).toContain('refine.successive-elongations');
    expect(rules(ask({ health: 'average' }), scots)).not.toContain('refine.successive-elongations');
    expect(evaluate(ask(), mugo, north).watch.join(' ')).toMatch(/three elongations/);
  });

  it('never decandles a single-flush pine, even strong in early summer', () => {
    // common practice, no published source
    for (const shoot of shootStates) {
      for (const health of healthLevels) {
        const r = evaluate(ask({ shoot, health, date: '2027-06-15' }), scots, north);
        expect(r.action).not.toBe('decandle');
      }
    }
    expect(rules(ask({ date: '2027-06-15', health: 'strong' }))).toContain('flush.single-never-decandle');
  });
});

describe('refinement: double-flush pine', () => {
  it('decandles a strong, healthy tree in early summer once the spring candles have extended', () => {
    // common practice, no published source
    for (const shoot of ['candle-extending', 'needles-opening', 'needles-hardened'] as const) {
      const r = evaluate(ask({ species: blackPine.slug, health: 'strong', shoot, date: '2027-06-20' }), blackPine, north);
      expect(r.action).toBe('decandle');
      expect(r.keepNeedlePairs).toBeNull();
      expect(r.reasons.map((x) => x.rule)).toContain('flush.double-decandle');
      expect(r.cautions.map((c) => c.text).join(' ')).toMatch(/sharp tools/);
    }
  });

  it('waits in spring for the candles to extend', () => {
    // common practice, no published source
    const r = evaluate(ask({ health: 'strong', date: '2027-05-10' }), blackPine, north);
    expect(r.action).toBe('wait');
    expect(r.reasons.map((x) => x.rule)).toContain('flush.double-wait-for-early-summer');
  });

  it('does not decandle after early summer', () => {
    // common practice, no published source
    const r = evaluate(ask({ health: 'strong', shoot: 'needles-hardened', date: '2027-08-10' }), blackPine, north);
    expect(r.action).toBe('wait');
    expect(r.reasons.map((x) => x.rule)).toContain('flush.double-decandle-window-passed');
  });

  it('pinches instead on a tree that is only average', () => {
    // common practice, no published source
    const r = evaluate(ask({ health: 'average', date: '2027-06-20' }), blackPine, north);
    expect(r.action).toBe('pinch');
    expect(r.reasons.map((x) => x.rule)).toEqual(expect.arrayContaining(['flush.double-not-strong', 'refine.keep-part-of-candle']));
  });

  it('never decandles a weak or development-stage tree', () => {
    // common practice, no published source
    for (const shoot of shootStates) {
      const weak = evaluate(ask({ health: 'weak', shoot, date: '2027-06-20' }), blackPine, north);
      expect(weak.action).not.toBe('decandle');
      for (const branching of ['primary', 'secondary'] as const) {
        const dev = evaluate(ask({ branching, health: 'strong', shoot, date: '2027-06-20' }), blackPine, north);
        expect(dev.action).not.toBe('decandle');
      }
    }
    expect(rules(ask({ branching: 'secondary', health: 'strong', date: '2027-06-20' }), blackPine)).toContain('flush.no-decandle-development');
    expect(rules(ask({ health: 'weak', date: '2027-06-20' }), blackPine)).toContain('flush.no-decandle-weak');
  });

  it('lets interior shoots grow even in the decandling window', () => {
    // common practice, no published source
    expect(evaluate(ask({ health: 'strong', position: 'interior', date: '2027-06-20' }), blackPine, north).action).toBe('let-grow');
  });
});

describe('development: growth first, then prune', () => {
  it('lets candles extend and needle out', () => {
    // common practice, no published source
    for (const shoot of ['candle-extending', 'needles-opening'] as const) {
      for (const position of positions) {
        const r = evaluate(ask({ branching: 'secondary', shoot, position, date: '2027-05-20' }), scots, north);
        expect(r).toMatchObject({ stage: 'development', action: 'let-grow', keepNeedlePairs: null });
        expect(r.reasons.map((x) => x.rule)).toEqual(expect.arrayContaining(['develop.let-extend', 'develop.no-early-prune']));
      }
    }
  });

  it('prunes once back buds are present and needles have hardened, leaving at least two pairs', () => {
    // common practice, no published source
    const r = evaluate(ask({ branching: 'primary', shoot: 'needles-hardened', backBuds: true, date: '2027-08-01' }), scots, north);
    expect(r).toMatchObject({ action: 'prune', keepNeedlePairs: 2 });
    expect(r.headline).toMatch(/leave at least 2 pairs/);
    expect(r.reasons.map((x) => x.rule)).toContain('develop.prune-hardened-with-back-buds');
  });

  it('keeps growing while there are no back buds', () => {
    // common practice, no published source
    const r = evaluate(ask({ branching: 'primary', shoot: 'needles-hardened', backBuds: false, date: '2027-08-01' }), scots, north);
    expect(r.action).toBe('let-grow');
    expect(r.reasons.map((x) => x.rule)).toContain('develop.wait-for-back-buds');
  });

  it('does not need the position against the silhouette', () => {
    const a = evaluate(ask({ branching: 'secondary', position: undefined }), scots, north);
    const b = evaluate(ask({ branching: 'secondary', position: 'beyond-silhouette' }), scots, north);
    expect(a.action).toBe(b.action);
  });
});

describe('season and hemisphere', () => {
  it('reads the same date as opposite seasons in the two hemispheres', () => {
    // common practice, no published source
    const n = evaluate(ask({ date: '2027-10-15', hemisphere: 'north', shoot: 'candle-extending' }), scots, north);
    const s = evaluate(ask({ date: '2027-10-15', hemisphere: 'south', shoot: 'candle-extending' }), scots, north);
    expect(n.season).toBe('autumn');
    expect(s.season).toBe('spring');
    expect(s.action).toBe('pinch');
    expect(s.reasons.map((x) => x.rule)).toContain('season.south-shift');
    expect(s.dayLength.latitude).toBe(-45);
  });

  it('answers an out-of-season shoot state with a caution to check the observation', () => {
    // common practice, no published source: a candle extending in the northern autumn is unusual
    const r = evaluate(ask({ date: '2027-10-20', shoot: 'candle-extending' }), scots, north);
    expect(r.season).toBe('autumn');
    expect(r.action).toBe('pinch');
    expect(r.reasons.map((x) => x.rule)).toContain('season.out-of-season');
    expect(r.cautions[0].text).toMatch(/Check the observation/);
    // the same state in spring is not flagged
    expect(rules(ask({ date: '2027-05-10' }))).not.toContain('season.out-of-season');
  });

  it('flags out-of-season states by month of season', () => {
    const s = (iso: string) => seasonOf(parseIsoDate(iso)!, 'north');
    expect(isOutOfSeason('candle-extending', s('2027-01-10'))).toBe(true);
    expect(isOutOfSeason('needles-opening', s('2027-09-10'))).toBe(false);
    expect(isOutOfSeason('needles-opening', s('2027-11-10'))).toBe(true);
    expect(isOutOfSeason('needles-hardened', s('2027-03-10'))).toBe(true);
    expect(isOutOfSeason('needles-hardened', s('2027-05-20'))).toBe(false);
    expect(isOutOfSeason('dormant-bud', s('2027-07-10'))).toBe(false);
  });

  it('waits in winter dormancy and does not feed', () => {
    // common practice, no published source
    const r = evaluate(ask({ shoot: 'dormant-bud', date: '2027-01-15' }), scots, north);
    expect(r).toMatchObject({ season: 'winter', action: 'wait' });
    expect(r.reasons.map((x) => x.rule)).toContain('season.winter-dormant');
    expect(r.fertilizer.feedNow).toBe(false);
  });

  it('uses the club setting when the input names neither hemisphere nor latitude', () => {
    const r = evaluate(ask({ date: '2027-10-10' }), scots, southClub);
    expect(r.hemisphere).toBe('south');
    expect(r.season).toBe('spring');
    expect(r.dayLength.latitude).toBeCloseTo(-37.8, 5);
  });

  it('falls back to the context date', () => {
    const r = evaluate(ask({ date: undefined }), scots, { ...north, today: '2027-01-05' });
    expect(r.season).toBe('winter');
    expect(r.date).toBe('2027-01-05');
  });

  it('shows the day length', () => {
    // source: NOAA check value at 45° N on 20 Jun 2024, botany-sources.md §5
    const r = evaluate(ask({ date: '2024-06-20' }), scots, north);
    expect(Math.abs(r.dayLength.hours - 15.617)).toBeLessThan(1 / 60);
    expect(r.dayLength.text).toMatch(/^15 h 37 min of daylight at 45\.0° N$/);
  });
});

describe('cautions', () => {
  it('always warns about organic fertiliser around pets and children and defers to labels', () => {
    // common practice, no published source
    const c = evaluate(ask(), scots, north).cautions.map((x) => x.text).join(' ');
    expect(c).toMatch(/pets and children/);
    expect(c).toMatch(/gloves/);
    expect(c).toMatch(/label/);
  });
  it('warns about fish emulsion when the plan has a foliar feed', () => {
    // common practice, no published source
    const dev = evaluate(ask({ branching: 'secondary' }), scots, north);
    expect(dev.fertilizer.foliar).toBe(true);
    expect(dev.cautions.map((x) => x.text).join(' ')).toMatch(/Fish emulsion/);
    expect(evaluate(ask(), scots, north).cautions.map((x) => x.text).join(' ')).not.toMatch(/Fish emulsion/);
  });
  it('reminds about permission and permits for wild-collected trees', () => {
    // common practice, no published source
    expect(evaluate(ask({ recentlyCollected: true }), scots, north).cautions.map((x) => x.text).join(' ')).toMatch(/landowner’s permission.*permit/);
  });
  it('carries the species record’s own cautions (e.g. invasive where planted out)', () => {
    const r = evaluate(ask({ species: mugo.slug }), mugo, north);
    expect(r.cautions).toContainEqual({ text: mugo.cautions[0].text, source: 'from memory' });
  });
  it('says when the species is not a pine', () => {
    expect(rules(ask(), juniper)[0]).toBe('scope.not-a-pine');
  });
});

describe('the rule set', () => {
  it('every reason names a known rule with a source', () => {
    const seen = new Set<string>();
    for (const branching of branchingLevels)
      for (const shoot of shootStates)
        for (const position of positions)
          for (const health of healthLevels)
            for (const sp of [scots, blackPine, mugo])
              for (const date of ['2027-01-10', '2027-04-15', '2027-06-20', '2027-08-20', '2027-10-20'])
                for (const hemisphere of ['north', 'south'] as const)
                  for (const flags of [{ backBuds: true }, { backBuds: false }, { recentlyCollected: true }]) {
                    const r = evaluate({ species: sp.slug, branching, shoot, position, health, date, hemisphere, ...flags, container: { shape: 'round', lengthCm: 30 } }, sp, north);
                    expect(r.engineVersion).toBe(ENGINE_VERSION);
                    expect(r.speciesRevision).toBe(sp.revision);
                    expect(r.reasons.length).toBeGreaterThan(0);
                    expect(r.fertilizer.piles).not.toBeNull();
                    expect(r.fertilizer.pelletsPerPile).not.toBeNull();
                    if (r.action === 'pinch' || r.action === 'prune') expect(r.keepNeedlePairs).toBe(2);
                    else expect(r.keepNeedlePairs).toBeNull();
                    if (r.action === 'decandle') {
                      expect(sp.flushHabit).toBe('double');
                      expect(r.stage).toBe('refinement');
                      expect(health).toBe('strong');
                    }
                    for (const x of [...r.reasons, ...r.fertilizer.reasons]) {
                      expect(RULES[x.rule as keyof typeof RULES]).toBeDefined();
                      expect(['common practice', 'Candlewise rule (our own)']).toContain(x.source);
                      seen.add(x.rule);
                    }
                  }
    // The sweep reaches every decision rule (scope.not-a-pine and pile scaling aside).
    const unreached = Object.keys(RULES).filter((id) => !seen.has(id) && !['scope.not-a-pine', 'feed.mid-sized-pot'].includes(id));
    expect(unreached).toEqual([]);
  });
});

describe('dueNow for a tree', () => {
  it('runs the engine on the shoot state typical of the date', () => {
    // common practice, no published source
    const may = dueNow({ species: scots, stage: 'refinement', date: '2027-04-20', hemisphere: 'north' });
    expect(may).toMatchObject({ season: 'spring', assumedShoot: 'candle-extending', action: 'pinch', feedNow: true });
    const southOct = dueNow({ species: scots, stage: 'refinement', date: '2027-10-20', hemisphere: 'south' });
    expect(southOct.action).toBe('pinch');
    const winter = dueNow({ species: scots, date: '2027-01-20', hemisphere: 'north' });
    expect(winter).toMatchObject({ season: 'winter', action: 'wait', feedNow: false });
    const bpJune = dueNow({ species: blackPine, stage: 'refinement', date: '2027-06-20', hemisphere: 'north' });
    expect(bpJune.action).toBe('decandle');
    const dev = dueNow({ species: scots, stageHint: 'development', date: '2027-08-20', hemisphere: 'north' });
    expect(dev.action).toBe('prune');
    const rec = dueNow({ species: scots, stage: 'recovery', date: '2027-05-20', hemisphere: 'north' });
    expect(rec.action).toBe('let-grow');
    expect(may.rules).toContain('refine.pinch-soft-candle');
  });
});
