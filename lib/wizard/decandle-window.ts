import type { Hemisphere } from './types';

// When a strong double-flush pine may have its spring candles cut. No published rule exists for
// this timing, so it is our own stated rule, adjustable per club:
//
// 1. The growing season ends earlier the further from the equator: we take its end (the usual
//    first autumn frost) as day 340 of the northern year at 25° latitude, moving 3 days earlier
//    per degree beyond (day 280, early October, at 45°; day 235, late August, at 60°).
// 2. The second flush needs about 95 days to extend and harden before that end, so the window
//    closes 95 days before it.
// 3. It opens 35 days before it closes, but never before day 145 (25 May), because the spring
//    candles must first finish extending. Where opening would fall after closing, the season is
//    too short and there is no window (about 57° and beyond).
// 4. The club can move the whole window by up to ±30 days in its settings.
// 5. Within the tropics the calendar says nothing; the shoot state alone decides.
// 6. Where a heat sum is supplied, candles are not cut below DECANDLE_MIN_DEGREE_DAYS (°C days
//    above +5 °C since the start of the year's season), whatever the date: our own threshold for
//    "spring shoot growth is largely done" in a temperate garden.

export const TROPIC_LATITUDE = 23.44;
const SECOND_FLUSH_DAYS = 95;
const WINDOW_DAYS = 35;
const EARLIEST_OPEN_DAY = 145;
export const DECANDLE_MIN_DEGREE_DAYS = 450;
const MAX_CLUB_OFFSET_DAYS = 30;

function seasonEndDay(absLatitude: number): number {
  return Math.round(340 - 3 * Math.max(0, absLatitude - 25));
}

interface DecandleWindow {
  /** Day of the (hemisphere-shifted) year the window opens and closes, or null in the tropics / none. */
  openDay: number;
  closeDay: number;
}

/**
 * The window as days of the grower's own year (in the south, day 1 is 1 July, so the same numbers
 * mean the same point of the season). null when the season is too short for a second flush.
 */
function decandleWindow(latitude: number, clubOffsetDays = 0): DecandleWindow | null {
  const abs = Math.abs(latitude);
  const offset = Math.max(-MAX_CLUB_OFFSET_DAYS, Math.min(MAX_CLUB_OFFSET_DAYS, Math.round(clubOffsetDays)));
  const closeDay = seasonEndDay(abs) - SECOND_FLUSH_DAYS + offset;
  const openDay = Math.max(EARLIEST_OPEN_DAY + offset, closeDay - WINDOW_DAYS);
  return openDay >= closeDay ? null : { openDay, closeDay };
}

/** Day of the year, counted from 1 January in the north and from 1 July in the south. */
function seasonalDayOfYear(date: Date, hemisphere: Hemisphere): number {
  const y = date.getUTCFullYear();
  if (hemisphere === 'north') return Math.floor((date.getTime() - Date.UTC(y, 0, 1, 12)) / 86_400_000) + 1;
  const start = date.getUTCMonth() >= 6 ? Date.UTC(y, 6, 1, 12) : Date.UTC(y - 1, 6, 1, 12);
  return Math.floor((date.getTime() - start) / 86_400_000) + 1;
}

export type WindowPosition = 'before' | 'open' | 'after' | 'none' | 'tropics';

export function decandleWindowPosition(date: Date, hemisphere: Hemisphere, latitude: number, clubOffsetDays = 0): WindowPosition {
  if (Math.abs(latitude) < TROPIC_LATITUDE) return 'tropics';
  const w = decandleWindow(latitude, clubOffsetDays);
  if (!w) return 'none';
  const day = seasonalDayOfYear(date, hemisphere);
  if (day < w.openDay) return 'before';
  return day <= w.closeDay ? 'open' : 'after';
}
