import { describe, expect, it } from 'vitest';
import { circleArea, ellipseArea, rectangleArea, surfaceAreaCm2 } from '@/lib/wizard/container';
import { K2O_TO_K, P2O5_TO_P, feedingPlan, gramsPerLitreForN, liquidFeedPpm, ozPer100GalToGramsPerLitre, pilesForSurface } from '@/lib/wizard/feeding';
import { blackPine, mugo, scots } from '../../support/wizard-fixtures';

describe('container soil surface', () => {
  it('uses π r² for a round pot, l × w for a rectangle, π a b for an oval', () => {
    // from memory: circle, rectangle and ellipse area formulas
    expect(circleArea(20)).toBeCloseTo(314.159, 2);
    expect(rectangleArea(40, 30)).toBe(1200);
    expect(ellipseArea(40, 30)).toBeCloseTo(942.478, 2);
    expect(surfaceAreaCm2({ shape: 'round', lengthCm: 20 })).toBeCloseTo(314.159, 2);
    expect(surfaceAreaCm2({ shape: 'rectangle', lengthCm: 40, widthCm: 30 })).toBe(1200);
    expect(surfaceAreaCm2({ shape: 'oval', lengthCm: 40, widthCm: 30 })).toBeCloseTo(942.478, 2);
  });
});

describe('pile count scales with the soil surface (our own rule)', () => {
  // common practice, no published source: ~4 piles refinement, ~twice that in development, for ~1 200 cm²
  it('gives four and eight piles for a 40 × 30 cm pot', () => {
    expect(pilesForSurface(1200, 'moderate').piles).toBe(4);
    expect(pilesForSurface(1200, 'heavy').piles).toBe(8);
  });
  it('grows with the area; a pot too small for a full pile gets one smaller pile', () => {
    expect(pilesForSurface(2400, 'moderate').piles).toBe(8);
    expect(pilesForSurface(600, 'moderate').piles).toBe(2);
    expect(pilesForSurface(50, 'moderate')).toEqual({ piles: 1, pellets: { min: 1, max: 1 } });
    expect(pilesForSurface(50, 'heavy').piles).toBe(1);
    for (const a of [200, 500, 900, 1200, 1800, 3000]) {
      expect(pilesForSurface(a, 'heavy').piles).toBeGreaterThanOrEqual(pilesForSurface(a, 'moderate').piles);
    }
  });
});

describe('feeding plan', () => {
  const base = { shoot: 'candle-extending' as const, weak: false };

  it('refinement: moderate pellets spring to autumn, purpose first, no foliar', () => {
    // common practice, no published source
    const p = feedingPlan({ ...base, stage: 'refinement', season: 'spring', species: scots, container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 } });
    expect(p.reasons[0].rule).toBe('feed.purpose-refinement');
    expect(p).toMatchObject({ feedNow: true, piles: 4, pelletsPerPile: { min: 6, max: 8 }, foliar: false, surfaceCm2: 1200 });
    expect(p.window).toMatch(/spring through autumn/i);
    expect(p.placement).toMatch(/halfway between trunk and rim/);
    expect(p.reasons.map((r) => r.rule)).toEqual(expect.arrayContaining(['feed.why-organic', 'feed.pile-scaling', 'feed.not-heavy-in-refinement']));
    const scaling = p.reasons.find((r) => r.rule === 'feed.pile-scaling')!;
    expect(scaling.text).toMatch(/our own rule/);
    expect(scaling.source).toMatch(/our own/);
  });

  it('development: heavy pellets, twice the piles, foliar feed', () => {
    // common practice, no published source
    const p = feedingPlan({ ...base, stage: 'development', season: 'summer', species: scots, container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 } });
    expect(p.reasons[0].rule).toBe('feed.purpose-development');
    expect(p).toMatchObject({ feedNow: true, piles: 8, pelletsPerPile: { min: 10, max: 12 }, foliar: true });
  });

  it('pellets per pile do not scale with the pot', () => {
    // common practice, no published source
    const small = feedingPlan({ ...base, stage: 'refinement', season: 'summer', species: scots, container: { shape: 'round', lengthCm: 25 } });
    const big = feedingPlan({ ...base, stage: 'refinement', season: 'summer', species: scots, container: { shape: 'oval', lengthCm: 70, widthCm: 50 } });
    expect(small.pelletsPerPile).toEqual(big.pelletsPerPile);
    expect(big.piles!).toBeGreaterThan(small.piles!);
  });

  it('without a container: piles null, pellets still given, a mid-sized pot assumed', () => {
    const p = feedingPlan({ ...base, stage: 'refinement', season: 'spring', species: scots });
    expect(p.piles).toBeNull();
    expect(p.surfaceCm2).toBeNull();
    expect(p.pelletsPerPile).toEqual({ min: 6, max: 8 });
    expect(p.reasons.map((r) => r.rule)).toContain('feed.mid-sized-pot');
    expect(p.placement).toMatch(/^About 4 piles/);
  });

  it('no feeding in winter dormancy', () => {
    // common practice, no published source
    for (const stage of ['refinement', 'development', 'recovery'] as const) {
      const p = feedingPlan({ ...base, shoot: 'dormant-bud', stage, season: 'winter', species: scots });
      expect(p.feedNow).toBe(false);
      expect(p.reasons.map((r) => r.rule)).toContain('feed.winter-none');
    }
  });

  it('holds back spring feeding in refinement for species whose needles lengthen strongly with feeding', () => {
    // common practice, no published source (mugo)
    const spring = feedingPlan({ ...base, stage: 'refinement', season: 'spring', species: mugo });
    expect(spring.feedNow).toBe(false);
    expect(spring.window).toMatch(/needles have hardened/);
    expect(spring.reasons.map((r) => r.rule)).toContain('feed.hold-back-strong-needle-response');
    const hardened = feedingPlan({ ...base, shoot: 'needles-hardened', stage: 'refinement', season: 'spring', species: mugo });
    expect(hardened.feedNow).toBe(true);
    // The shoot decides, not the calendar: candles still extending in summer are still held back.
    expect(feedingPlan({ ...base, stage: 'refinement', season: 'summer', species: mugo }).feedNow).toBe(false);
    expect(feedingPlan({ ...base, shoot: 'needles-hardened', stage: 'refinement', season: 'summer', species: mugo }).feedNow).toBe(true);
    // not held back in development, nor for a species with a moderate response
    expect(feedingPlan({ ...base, stage: 'development', season: 'spring', species: mugo }).feedNow).toBe(true);
    expect(feedingPlan({ ...base, stage: 'refinement', season: 'spring', species: blackPine }).feedNow).toBe(true);
  });

  it('recovery: no pellets for a collected tree until roots show, light feeding for a weak one', () => {
    // source: University of Maryland Extension, "After planting care"; weak-tree rate: common practice, no published source
    const collected = feedingPlan({
      ...base,
      stage: 'recovery',
      season: 'summer',
      species: scots,
      recentlyCollected: true,
      container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 },
    });
    expect(collected).toMatchObject({ feedNow: false, piles: null, pelletsPerPile: null, renewWeeks: null });
    expect(collected.reasons[0].rule).toBe('feed.purpose-recovery-collected');
    const weak = feedingPlan({
      ...base,
      stage: 'recovery',
      season: 'summer',
      species: scots,
      weak: true,
      container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 },
    });
    expect(weak.pelletsPerPile).toEqual({ min: 3, max: 4 });
    expect(weak.piles).toBe(3);
    expect(weak.reasons[0].rule).toBe('feed.purpose-recovery-weak');
  });
});

describe('liquid feed calculator', () => {
  it('uses the stoichiometric oxide factors', () => {
    // source: Penn State Turfgrass Extension (×0.44, ×0.83); Virginia Cooperative Extension SPES-201NP (0.4365, 0.8301)
    expect(Math.abs(P2O5_TO_P - 0.4365)).toBeLessThanOrEqual(0.0002);
    expect(Math.abs(K2O_TO_K - 0.8301)).toBeLessThanOrEqual(0.0002);
    // source: Penn State worked examples: 20 % P2O5 → 8.8 % P; 10 % K2O → 8.3 % K (with their rounded ×0.44, ×0.83)
    expect(Math.abs(20 * P2O5_TO_P - 8.8)).toBeLessThan(20 * 0.0036 + 1e-9);
    expect(Math.abs(10 * K2O_TO_K - 8.3)).toBeLessThan(0.01);
  });

  it('gives 200 / 87.3 / 166.0 ppm for 1 g/L of a 20-20-20', () => {
    // source: metric form of UGA Extension Bulletin 931 Table 13 (botany-sources.md §3 worked check)
    const ppm = liquidFeedPpm(1, { n: 20, p2o5: 20, k2o: 20 });
    expect(ppm.n).toBeCloseTo(200, 6);
    expect(ppm.p).toBeCloseTo(87.3, 1);
    expect(ppm.k).toBeCloseTo(166.0, 1);
  });

  it('agrees with the US-unit extension examples', () => {
    // source: Texas A&M Hort IPM "Nutrition and fertility": 15 % N at 1 oz/100 gal → 11.25 ppm N (constant 75; exact 74.89)
    expect(liquidFeedPpm(ozPer100GalToGramsPerLitre(1), { n: 15, p2o5: 0, k2o: 0 }).n).toBeCloseTo(11.23, 1);
    // source: UMass Extension "Fertilizer Calculations for Greenhouse Crops": 20-20-20 at 13.35 oz/100 gal → 200 ppm N
    expect(liquidFeedPpm(ozPer100GalToGramsPerLitre(13.35), { n: 20, p2o5: 20, k2o: 20 }).n).toBeCloseTo(200, 0);
  });

  it('inverts for a target nitrogen level', () => {
    // source: metric form of UGA Extension Bulletin 931 Table 13
    expect(gramsPerLitreForN(200, 20)).toBeCloseTo(1, 6);
    expect(() => gramsPerLitreForN(100, 0)).toThrow();
  });
});
