import SunCalc from 'suncalc';
import type { DayLength, Hemisphere, Season, WizardContext } from './types';

/** Parse an ISO calendar date (YYYY-MM-DD) as noon UTC, or null if it is not a real date. */
export function parseIsoDate(iso: string): Date | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  if (!m) return null;
  const d = new Date(Date.UTC(+m[1], +m[2] - 1, +m[3], 12));
  if (d.getUTCFullYear() !== +m[1] || d.getUTCMonth() !== +m[2] - 1 || d.getUTCDate() !== +m[3]) return null;
  return d;
}

/**
 * Which hemisphere applies: an explicit choice wins, then the sign of the latitude,
 * then the club setting.
 */
export function resolveHemisphere(input: { hemisphere?: Hemisphere; latitude?: number }, context: Pick<WizardContext, 'hemisphere'>): Hemisphere {
  if (input.hemisphere) return input.hemisphere;
  if (typeof input.latitude === 'number' && input.latitude !== 0) return input.latitude < 0 ? 'south' : 'north';
  return context.hemisphere;
}

/**
 * The latitude for day length. A given latitude is used, else the club's; its sign is made to
 * agree with the hemisphere in force, because the hemisphere wins when the two disagree.
 */
export function resolveLatitude(input: { latitude?: number }, hemisphere: Hemisphere, context: Pick<WizardContext, 'latitude'>): number {
  const lat = Math.abs(input.latitude ?? context.latitude);
  return hemisphere === 'south' ? -lat : lat;
}

export interface SeasonInfo {
  season: Season;
  /** 1, 2 or 3: the month within the (meteorological) season. */
  monthOfSeason: 1 | 2 | 3;
  /** Day within the season, from 0. */
  dayOfSeason: number;
}

const NORTH: Season[] = ['winter', 'winter', 'spring', 'spring', 'spring', 'summer', 'summer', 'summer', 'autumn', 'autumn', 'autumn', 'winter'];

/**
 * Meteorological seasons: in the north March–May is spring, June–August summer, September–November
 * autumn, December–February winter. The south is the same calendar shifted by six months.
 */
export function seasonOf(date: Date, hemisphere: Hemisphere): SeasonInfo {
  const month = date.getUTCMonth();
  const shifted = hemisphere === 'south' ? (month + 6) % 12 : month;
  const season = NORTH[shifted];
  // Seasons start in the northern months 2, 5, 8, 11 (Mar, Jun, Sep, Dec).
  const startShifted = shifted === 0 || shifted === 1 ? 11 : shifted - ((shifted - 2) % 3);
  const monthOfSeason = (((shifted - startShifted + 12) % 12) + 1) as 1 | 2 | 3;
  const startMonth = hemisphere === 'south' ? (startShifted + 6) % 12 : startShifted;
  let startYear = date.getUTCFullYear();
  if (startMonth > month) startYear -= 1;
  const start = Date.UTC(startYear, startMonth, 1, 12);
  const dayOfSeason = Math.round((date.getTime() - start) / 86_400_000);
  return { season, monthOfSeason, dayOfSeason };
}

/** Early summer: the first six weeks of summer, the window for decandling a double-flush pine. */
export function isEarlySummer(info: SeasonInfo): boolean {
  return info.season === 'summer' && info.dayOfSeason < 45;
}

/**
 * Day length (sunrise to sunset, with the standard 0.833° refraction allowance) at a latitude,
 * computed with suncalc at longitude 0 for the given date.
 */
export function dayLengthHours(date: Date, latitude: number): number {
  const noon = new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate(), 12));
  const t = SunCalc.getTimes(noon, latitude, 0);
  const rise = t.sunrise.getTime();
  const set = t.sunset.getTime();
  if (Number.isNaN(rise) || Number.isNaN(set)) {
    // Polar day or night: is the sun up at solar noon?
    const alt = SunCalc.getPosition(t.solarNoon, latitude, 0).altitude;
    return alt > (-0.833 * Math.PI) / 180 ? 24 : 0;
  }
  return (set - rise) / 3_600_000;
}

export function formatHours(hours: number): string {
  const total = Math.round(hours * 60);
  const h = Math.floor(total / 60);
  const m = total % 60;
  return `${h} h ${String(m).padStart(2, '0')} min`;
}

export function dayLength(date: Date, latitude: number): DayLength {
  const hours = dayLengthHours(date, latitude);
  const where = `${Math.abs(latitude).toFixed(1)}° ${latitude < 0 ? 'S' : 'N'}`;
  return { hours: Math.round(hours * 1000) / 1000, latitude, text: `${formatHours(hours)} of daylight at ${where}` };
}
