import { addDays, dailyDegreeDays, daysBetween, DEFAULT_BASE_C, type DayTemps } from './degree-days';

// When each shoot state is expected this season, from thermal time: the heat sum above +5 °C
// since the season began, as a share of the site's long-term annual sum.
//
// Published relation used: Scots pine height growth reached 95% of its final length at 41%
// (38–43%) of the site's long-term annual temperature sum above +5 °C ("Intra-annual height increment of Pinus sylvestris at high latitudes in Finland", Tree Physiol.
// 27(9):1347–1353). It was measured in northern boreal Lapland; at warmer sites it is our best
// published anchor, and a grower's own observation re-anchors it (see plan.ts).
// Shoot elongation follows a sigmoid in thermal time (a sigmoid growth model for Scots pine shoots, Annals of Botany 2013).
// No published heat sum exists for the start of candle elongation, so that share is our own rule.

/** Share of the annual sum at which the shoot has made 95% of its length. source: “Intra-annual height increment of Pinus sylvestris at high latitudes in Finland”, Tree Physiology 27(9):1347–1353 (2007) */
export const ELONGATION_DONE_SHARE = 0.41;
/** Our own rule (no published value found): candles begin to extend at a tenth of the annual sum. */
export const CANDLE_START_SHARE = 0.1;
/** Our own rule: needles break out of their sheaths over the last quarter or so of elongation. */
const NEEDLES_OPEN_SHARE = 0.3;
/** Our own rule, following the common practice of repotting as buds swell (pines come out of dormancy first). */
const BUD_SWELL_SHARE = 0.03;

export type SeasonHemisphere = 'north' | 'south';

/** The first day of the season year that holds `today`: 1 January in the north, 1 July in the south. */
export function seasonStart(today: string, hemisphere: SeasonHemisphere): string {
  const y = Number(today.slice(0, 4));
  if (hemisphere === 'north') return `${y}-01-01`;
  return today.slice(5) >= '07-01' ? `${y}-07-01` : `${y - 1}-07-01`;
}

/**
 * A rough daily mean temperature by latitude, for clubs without a record: a sine over the year
 * peaking in late July (late January in the south), with a mean and a swing that change with
 * latitude. // from memory: our own approximation of temperate coastal-to-continental climates,
 * not a published model. Within the tropics it is not used (see `tropical`).
 */
function latitudeMeanTemp(latitude: number, dayOfSeasonYear: number): number {
  const lat = Math.abs(latitude);
  const mean = 30 - 0.38 * lat; // from memory: 45° → about 13 °C, 60° → about 7 °C
  const swing = 3 + 0.18 * lat; // from memory: half the yearly range, 45° → about 11 °C
  // Day 0 is 1 January (north) or 1 July (south); the warmest day is about day 200 of either.
  return mean + swing * Math.cos((2 * Math.PI * (dayOfSeasonYear - 200)) / 365);
}

export const tropical = (latitude: number) => Math.abs(latitude) < 23.5;

/** A season year of days from the latitude model. */
export function latitudeYear(latitude: number, start: string): DayTemps[] {
  return Array.from({ length: 365 }, (_, i) => {
    const t = latitudeMeanTemp(latitude, i);
    return { date: addDays(start, i), tmin: t, tmax: t };
  });
}

export interface ThermalSeason {
  start: string;
  /** Expected long-term heat sum of a whole season year above the base. */
  annualSum: number;
  /** Heat sum each day of this season year (index 0 = start), measured where known, projected after. */
  cumulative: number[];
  /** Index of the last measured day, or -1 if nothing of this season was measured. */
  measuredThrough: number;
}

/**
 * Sum this season: measured days as far as they go, then each later day projected from the mean
 * of the same day in earlier years (or the latitude model where no earlier year has it).
 */
export function thermalSeason(opts: {
  start: string;
  latitude: number;
  /** This season's measured days (any order; outside the season year ignored). */
  thisYear?: DayTemps[];
  /** Earlier season years, each an array of that year's days. */
  earlierYears?: DayTemps[][];
  base?: number;
}): ThermalSeason {
  const base = opts.base ?? DEFAULT_BASE_C;
  const model = latitudeYear(opts.latitude, opts.start).map((d) => dailyDegreeDays(d.tmin, d.tmax, base));
  // Day-of-season climatology from earlier years.
  const sums = new Array(365).fill(0);
  const counts = new Array(365).fill(0);
  const fullTotals: number[] = [];
  for (const year of opts.earlierYears ?? []) {
    if (!year.length) continue;
    const yStart = year[0].date.slice(0, 4) + opts.start.slice(4);
    const first = daysBetween(yStart, year[0].date) < 0 ? `${Number(yStart.slice(0, 4)) - 1}${yStart.slice(4)}` : yStart;
    let total = 0;
    for (const d of year) {
      const i = daysBetween(first, d.date);
      if (i < 0 || i >= 365) continue;
      const g = dailyDegreeDays(d.tmin, d.tmax, base);
      sums[i] += g;
      counts[i] += 1;
      total += g;
    }
    if (year.length >= 360) fullTotals.push(total);
  }
  const climate = model.map((m, i) => (counts[i] ? sums[i] / counts[i] : m));
  const measured = new Map<number, number>();
  for (const d of opts.thisYear ?? []) {
    const i = daysBetween(opts.start, d.date);
    if (i >= 0 && i < 365) measured.set(i, dailyDegreeDays(d.tmin, d.tmax, base));
  }
  let measuredThrough = -1;
  for (const i of measured.keys()) measuredThrough = Math.max(measuredThrough, i);
  let sum = 0;
  const cumulative = climate.map((c, i) => (sum += measured.get(i) ?? c));
  const annualSum = fullTotals.length ? fullTotals.reduce((a, b) => a + b, 0) / fullTotals.length : climate.reduce((a, b) => a + b, 0);
  return { start: opts.start, annualSum, cumulative, measuredThrough };
}

export type ExpectedShoot = 'dormant-bud' | 'candle-extending' | 'needles-opening' | 'needles-hardened';

export interface ShootTimeline {
  budSwell: string;
  candleStart: string;
  needlesOpen: string;
  hardened: string;
}

/** The first day the heat sum reaches `share` of the annual sum (the season's last day if never). */
function dayAtShare(t: ThermalSeason, share: number): string {
  const target = share * t.annualSum;
  const i = t.cumulative.findIndex((c) => c >= target);
  return addDays(t.start, i < 0 ? 364 : i);
}

export function shootTimeline(t: ThermalSeason): ShootTimeline {
  return {
    budSwell: dayAtShare(t, BUD_SWELL_SHARE),
    candleStart: dayAtShare(t, CANDLE_START_SHARE),
    needlesOpen: dayAtShare(t, NEEDLES_OPEN_SHARE),
    hardened: dayAtShare(t, ELONGATION_DONE_SHARE),
  };
}

/** The shoot state expected on a date of the season year. */
export function expectedShoot(tl: ShootTimeline, date: string): ExpectedShoot {
  if (date < tl.candleStart) return 'dormant-bud';
  if (date < tl.needlesOpen) return 'candle-extending';
  if (date < tl.hardened) return 'needles-opening';
  return 'needles-hardened';
}

/** Move every transition by `days` (an observation re-anchoring the season). */
export function shiftTimeline(tl: ShootTimeline, days: number): ShootTimeline {
  return {
    budSwell: addDays(tl.budSwell, days),
    candleStart: addDays(tl.candleStart, days),
    needlesOpen: addDays(tl.needlesOpen, days),
    hardened: addDays(tl.hardened, days),
  };
}
