import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSpeciesDir } from '@/lib/species/content-dir';
import { toWizardSpecies, type WizardSpecies } from '@/lib/validation/species';
import { evaluate } from '@/lib/wizard/engine';
import { addDays, daysBetween, type DayTemps } from '@/lib/season/degree-days';
import { CANDLE_START_SHARE, ELONGATION_DONE_SHARE, expectedShoot, latitudeYear, shootTimeline, thermalSeason } from '@/lib/season/thermal';
import { anchorShift, dueSoon, planForTree, type PlanTree } from '@/lib/season/plan';

// Against the shipped species files.
const shipped = new Map<string, WizardSpecies>(
  readSpeciesDir(path.resolve(__dirname, '../../../content/species')).flatMap((f) =>
    f.result.ok ? [[f.result.record.slug, toWizardSpecies(f.result.record, 1)] as const] : [],
  ),
);
const sp = (slug: string) => shipped.get(slug)!;
const refinedStrong: PlanTree = { stage: 'refinement', health: 'strong', recentlyCollected: false };

/** A season of days from a sine climate, `warmer` °C added up to `warmUntil`. */
function year(y: number, warmer = 0, warmUntil = '9999-12-31'): DayTemps[] {
  return latitudeYear(45, `${y}-01-01`).map((d) => {
    const add = d.date <= warmUntil ? warmer : 0;
    return { date: d.date, tmin: d.tmin - 4 + add, tmax: d.tmax + 4 + add };
  });
}
const upTo = (days: DayTemps[], last: string) => days.filter((d) => d.date <= last);

describe('the thermal-time model against the relation it uses', () => {
  it('shoots finish extending (95% of length) at 41% of the long-term annual sum above +5 °C', () => {
    // source: “Intra-annual height increment of Pinus sylvestris at high latitudes in Finland”, Tree Physiology 27(9):1347–1353 (2007) — 41% (38–43%)
    expect(ELONGATION_DONE_SHARE).toBeGreaterThanOrEqual(0.38);
    expect(ELONGATION_DONE_SHARE).toBeLessThanOrEqual(0.43);
    const t = thermalSeason({ start: '2027-01-01', latitude: 45, earlierYears: [year(2024), year(2025), year(2026)] });
    const tl = shootTimeline(t);
    const i = daysBetween('2027-01-01', tl.hardened);
    expect(t.cumulative[i] / t.annualSum).toBeGreaterThanOrEqual(0.41);
    expect(t.cumulative[i - 1] / t.annualSum).toBeLessThan(0.41);
    // The long-term sum is the mean of the earlier complete years.
    const total = year(2025).reduce((s, d) => s + Math.max(0, (d.tmin + d.tmax) / 2 - 5), 0);
    expect(t.annualSum).toBeCloseTo(total, 6);
    expect(CANDLE_START_SHARE).toBeLessThan(ELONGATION_DONE_SHARE);
  });

  it('measured days count as measured; later days are projected from the earlier years', () => {
    const earlier = [year(2025), year(2026)];
    const thisYear = upTo(year(2027, 3), '2027-04-30');
    const t = thermalSeason({ start: '2027-01-01', latitude: 45, thisYear, earlierYears: earlier });
    expect(t.measuredThrough).toBe(daysBetween('2027-01-01', '2027-04-30'));
    const cool = thermalSeason({ start: '2027-01-01', latitude: 45, thisYear: upTo(year(2027), '2027-04-30'), earlierYears: earlier });
    expect(t.cumulative[t.measuredThrough]).toBeGreaterThan(cool.cumulative[cool.measuredThrough] + 100);
  });
});

describe('a tree’s plan', () => {
  const record = (warmer: number) => ({ thisYear: upTo(year(2027, warmer, '2027-04-30'), '2027-04-30'), earlierYears: [year(2024), year(2025), year(2026)] });

  it('the windows are the engine’s own answers on those days (no second copy of the rules)', () => {
    const plan = planForTree({
      species: sp('pinus-sylvestris'),
      tree: refinedStrong,
      today: '2027-04-30',
      hemisphere: 'north',
      latitude: 45,
      record: record(0),
    });
    expect(plan.basis).toBe('degree-days');
    const candle = plan.windows.find((w) => w.task === 'candle-work')!;
    expect(candle).toBeDefined();
    for (const date of [candle.from, candle.to]) {
      const r = evaluate(
        {
          species: 'pinus-sylvestris',
          branching: 'tertiary',
          date,
          hemisphere: 'north',
          latitude: 45,
          shoot: expectedShoot(plan.timeline!, date),
          position: 'beyond-silhouette',
          health: 'strong',
          recentlyCollected: false,
          candleStrength: 'strong',
        },
        sp('pinus-sylvestris'),
        { hemisphere: 'north', latitude: 45, today: date },
      );
      expect(r.action).toBe('pinch');
    }
    // The day before the window the engine does not say pinch.
    const before = addDays(candle.from, -1);
    const r = evaluate(
      {
        species: 'pinus-sylvestris',
        branching: 'tertiary',
        date: before,
        hemisphere: 'north',
        latitude: 45,
        shoot: expectedShoot(plan.timeline!, before),
        position: 'beyond-silhouette',
        health: 'strong',
        recentlyCollected: false,
        candleStrength: 'strong',
      },
      sp('pinus-sylvestris'),
      { hemisphere: 'north', latitude: 45, today: before },
    );
    expect(r.action).not.toBe('pinch');
    expect(candle.reasons[0]).toMatch(/Intra-annual height increment of Pinus sylvestris/);
    expect(plan.degreeDaysToDate).toBeGreaterThan(0);
  });

  it('a warmer spring gives earlier windows', () => {
    const normal = planForTree({
      species: sp('pinus-sylvestris'),
      tree: refinedStrong,
      today: '2027-04-30',
      hemisphere: 'north',
      latitude: 45,
      record: record(0),
    });
    const warm = planForTree({
      species: sp('pinus-sylvestris'),
      tree: refinedStrong,
      today: '2027-04-30',
      hemisphere: 'north',
      latitude: 45,
      record: record(3),
    });
    expect(warm.timeline!.hardened < normal.timeline!.hardened).toBe(true);
    const c = (p: typeof normal) => p.windows.find((w) => w.task === 'candle-work')!;
    expect(daysBetween(c(warm).from, c(normal).from)).toBeGreaterThanOrEqual(5);
    expect(warm.degreeDaysToDate!).toBeGreaterThan(normal.degreeDaysToDate!);
  });

  it('an observation of candles extending moves the windows and becomes the basis', () => {
    const base = planForTree({ species: sp('pinus-sylvestris'), tree: refinedStrong, today: '2027-05-20', hemisphere: 'north', latitude: 45 });
    expect(base.basis).toBe('latitude');
    const seenOn = addDays(base.timeline!.candleStart, -12);
    const moved = planForTree({
      species: sp('pinus-sylvestris'),
      tree: refinedStrong,
      today: '2027-05-20',
      hemisphere: 'north',
      latitude: 45,
      observations: [{ date: seenOn, shoot: 'candle-extending' }],
    });
    expect(moved.basis).toBe('observed');
    expect(moved.timeline!.candleStart).toBe(seenOn);
    const c = (p: typeof base) => p.windows.find((w) => w.task === 'candle-work')!;
    expect(daysBetween(c(moved).from, c(base).from)).toBe(12);
    expect(c(moved).basis).toBe('observed');
    expect(anchorShift(base.timeline!, { date: base.timeline!.candleStart, shoot: 'candle-extending' })).toBe(0);
  });

  it('a southern-hemisphere tree gets its windows six months on', () => {
    for (const slug of ['pinus-sylvestris', 'pinus-thunbergii']) {
      const n = planForTree({ species: sp(slug), tree: refinedStrong, today: '2027-03-01', hemisphere: 'north', latitude: 38 });
      const s = planForTree({ species: sp(slug), tree: refinedStrong, today: '2027-09-01', hemisphere: 'south', latitude: -38 });
      expect(s.seasonStart).toBe('2027-07-01');
      const tasks = (p: typeof n) => p.windows.map((w) => w.task);
      expect(tasks(s)).toEqual(tasks(n));
      expect(n.windows.length).toBeGreaterThanOrEqual(3);
      for (const [wn, ws] of n.windows.map((w, i) => [w, s.windows[i]] as const)) {
        // 1 Jan → 1 Jul is 181 days; allow the engine's month boundaries a few days' play.
        expect(Math.abs(daysBetween(wn.from, ws.from) - 181)).toBeLessThanOrEqual(4);
        expect(Math.abs(daysBetween(wn.to, ws.to) - 181)).toBeLessThanOrEqual(4);
      }
    }
    const scotsSouth = planForTree({ species: sp('pinus-sylvestris'), tree: refinedStrong, today: '2027-09-01', hemisphere: 'south', latitude: -38 });
    const candle = scotsSouth.windows.find((w) => w.task === 'candle-work')!;
    expect(['09', '10', '11', '12']).toContain(candle.from.slice(5, 7));
  });

  it('a recovering tree gets no candle work and no repotting', () => {
    const plan = planForTree({
      species: sp('pinus-sylvestris'),
      tree: { stage: 'recovery', health: 'weak', recentlyCollected: true },
      today: '2027-04-30',
      hemisphere: 'north',
      latitude: 45,
    });
    expect(plan.windows.map((w) => w.task)).not.toContain('candle-work');
    expect(plan.windows.map((w) => w.task)).not.toContain('repot');
  });

  it('done marks the window and takes it out of what is due', () => {
    const plan = planForTree({ species: sp('pinus-sylvestris'), tree: refinedStrong, today: '2027-04-30', hemisphere: 'north', latitude: 45 });
    const c = plan.windows.find((w) => w.task === 'candle-work')!;
    const today = c.from;
    expect(
      dueSoon(planForTree({ species: sp('pinus-sylvestris'), tree: refinedStrong, today, hemisphere: 'north', latitude: 45 }), today).map((w) => w.task),
    ).toContain('candle-work');
    const after = planForTree({
      species: sp('pinus-sylvestris'),
      tree: refinedStrong,
      today,
      hemisphere: 'north',
      latitude: 45,
      observations: [{ date: today, task: 'candle-work' }],
    });
    expect(after.windows.find((w) => w.task === 'candle-work')!.doneOn).toBe(today);
    expect(dueSoon(after, today).map((w) => w.task)).not.toContain('candle-work');
  });

  it('within the tropics it gives no calendar windows and says why', () => {
    const plan = planForTree({ species: sp('pinus-halepensis'), tree: refinedStrong, today: '2027-04-30', hemisphere: 'north', latitude: 10 });
    expect(plan.windows).toEqual([]);
    expect(plan.notes[0]).toMatch(/tropics/);
  });
});
