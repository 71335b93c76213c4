import { parseIsoDate } from '@/lib/wizard/season';
import type { DayTemps } from './degree-days';

// Reading a temperature record from CSV, in one of two layouts:
//  - plain: `date,tmin,tmax` in °C, ISO dates, an optional header line;
//  - NOAA GHCN-Daily per-station CSV (the by_station files): ID,YYYYMMDD,ELEMENT,DATA_VALUE,
//    M_FLAG,Q_FLAG,S_FLAG,OBS_TIME, values in tenths of °C, -9999 for missing. A value whose
//    quality flag (Q_FLAG) is set failed NOAA's checks and is skipped. Only TMAX and TMIN are read;
//    a day needs both. source: NOAA NCEI, GHCN-Daily readme (by_station format)
// Pure: the preview and the import both call it; nothing is written unless there are no errors.

interface CsvRowError {
  line: number;
  message: string;
}

export interface ParsedTemperatures {
  format: 'plain' | 'ghcn' | 'unknown';
  station: string | null;
  days: DayTemps[];
  errors: CsvRowError[];
  /** Values left out on purpose (quality-flagged, missing, half a day), with why. */
  skipped: CsvRowError[];
}

const MAX_CSV_LINES = 40_000;

const splitLines = (text: string) => text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
const GHCN_LINE = /^[A-Z0-9]{11},\d{8},[A-Z0-9]{4},/;

export function parseTemperatureCsv(text: string): ParsedTemperatures {
  const lines = splitLines(text);
  const first = lines.find((l) => l.trim() !== '') ?? '';
  if (lines.length > MAX_CSV_LINES) {
    return {
      format: 'unknown',
      station: null,
      days: [],
      errors: [{ line: MAX_CSV_LINES + 1, message: `At most ${MAX_CSV_LINES} lines in one file.` }],
      skipped: [],
    };
  }
  if (GHCN_LINE.test(first)) return parseGhcn(lines);
  return parsePlain(lines);
}

function num(s: string | undefined): number | null {
  if (s === undefined || !/^\s*[-+]?\d+(\.\d+)?\s*$/.test(s)) return null;
  return Number(s);
}

function checkDay(d: DayTemps, line: number, errors: CsvRowError[]) {
  if (d.tmin < -90 || d.tmax > 60 || d.tmax < -90 || d.tmin > 60) errors.push({ line, message: 'A temperature outside −90…60 °C is not a real reading.' });
  else if (d.tmin > d.tmax) errors.push({ line, message: `tmin ${d.tmin} is above tmax ${d.tmax}.` });
}

function parsePlain(lines: string[]): ParsedTemperatures {
  const days: DayTemps[] = [];
  const errors: CsvRowError[] = [];
  const seen = new Map<string, number>();
  lines.forEach((raw, i) => {
    const line = i + 1;
    const l = raw.trim();
    if (!l) return;
    const cells = l.split(',').map((c) => c.trim());
    if (i === 0 && /^date$/i.test(cells[0] ?? '')) {
      if (cells.length < 3 || !/^tmin$/i.test(cells[1]) || !/^tmax$/i.test(cells[2])) errors.push({ line, message: 'The header must be date,tmin,tmax.' });
      return;
    }
    if (cells.length !== 3) return void errors.push({ line, message: 'Give three values: date,tmin,tmax.' });
    const [date, a, b] = cells;
    if (!parseIsoDate(date)) return void errors.push({ line, message: `“${date.slice(0, 20)}” is not a date as YYYY-MM-DD.` });
    const tmin = num(a);
    const tmax = num(b);
    if (tmin === null || tmax === null) return void errors.push({ line, message: 'tmin and tmax must be numbers in °C.' });
    if (seen.has(date)) return void errors.push({ line, message: `${date} is already on line ${seen.get(date)}.` });
    seen.set(date, line);
    const d = { date, tmin, tmax };
    const before = errors.length;
    checkDay(d, line, errors);
    if (errors.length === before) days.push(d);
  });
  days.sort((x, y) => (x.date < y.date ? -1 : 1));
  if (!days.length && !errors.length) errors.push({ line: 1, message: 'The file holds no days.' });
  return { format: 'plain', station: null, days, errors, skipped: [] };
}

function parseGhcn(lines: string[]): ParsedTemperatures {
  const errors: CsvRowError[] = [];
  const skipped: CsvRowError[] = [];
  const byDate = new Map<string, { tmin?: number; tmax?: number; line: number }>();
  let station: string | null = null;
  lines.forEach((raw, i) => {
    const line = i + 1;
    if (!raw.trim()) return;
    const c = raw.split(',');
    if (c.length < 4 || !GHCN_LINE.test(raw)) return void errors.push({ line, message: 'Not a GHCN-Daily line (ID,YYYYMMDD,ELEMENT,VALUE,flags…).' });
    const [id, ymd, element, value, , qFlag] = c;
    if (station && id !== station) return void errors.push({ line, message: `Another station (${id}); import one station per file.` });
    station ??= id;
    if (element !== 'TMAX' && element !== 'TMIN') return;
    const date = `${ymd.slice(0, 4)}-${ymd.slice(4, 6)}-${ymd.slice(6, 8)}`;
    if (!parseIsoDate(date)) return void errors.push({ line, message: `${ymd} is not a real date.` });
    const v = num(value);
    if (v === null) return void errors.push({ line, message: 'The value is not a number.' });
    if (v === -9999) return void skipped.push({ line, message: `${element} on ${date} is missing (-9999).` });
    if (qFlag && qFlag.trim()) return void skipped.push({ line, message: `${element} on ${date} failed NOAA's quality check (flag ${qFlag.trim()}).` });
    const day = byDate.get(date) ?? { line };
    const key = element === 'TMAX' ? 'tmax' : 'tmin';
    if (day[key] !== undefined) return void errors.push({ line, message: `${element} on ${date} is given twice.` });
    day[key] = v / 10; // tenths of °C
    byDate.set(date, day);
  });
  const days: DayTemps[] = [];
  for (const [date, d] of [...byDate.entries()].sort(([a], [b]) => (a < b ? -1 : 1))) {
    if (d.tmin === undefined || d.tmax === undefined) {
      skipped.push({ line: d.line, message: `${date} has only ${d.tmin === undefined ? 'TMAX' : 'TMIN'}: the day is left out.` });
      continue;
    }
    const day = { date, tmin: d.tmin, tmax: d.tmax };
    const before = errors.length;
    checkDay(day, d.line, errors);
    if (errors.length === before) days.push(day);
  }
  if (!days.length && !errors.length) errors.push({ line: 1, message: 'The file holds no day with both TMAX and TMIN.' });
  skipped.sort((a, b) => a.line - b.line);
  return { format: 'ghcn', station, days, errors, skipped };
}
