import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseTemperatureCsv } from '@/lib/season/temperature-csv';
import { accumulate } from '@/lib/season/degree-days';

const sample = fs.readFileSync(path.resolve(__dirname, '../../fixtures/season/ghcnd-sample-ZZ000000001.csv'), 'utf8');

describe('NOAA GHCN-Daily per-station CSV', () => {
  const parsed = parseTemperatureCsv(sample);

  it('is recognised, values read as tenths of °C, other elements ignored', () => {
    // source: NOAA NCEI GHCN-Daily readme: TMAX/TMIN in tenths of degrees C
    expect(parsed.format).toBe('ghcn');
    expect(parsed.station).toBe('ZZ000000001');
    expect(parsed.errors).toEqual([]);
    expect(parsed.days[0]).toEqual({ date: '2026-04-01', tmin: 2, tmax: 11.2 });
    expect(parsed.days.find((d) => d.date === '2026-04-03')).toEqual({ date: '2026-04-03', tmin: -1.2, tmax: 9.8 });
  });

  it('skips quality-flagged and missing values, and days left with half a reading', () => {
    expect(parsed.days.map((d) => d.date)).toEqual(['2026-04-01', '2026-04-02', '2026-04-03', '2026-04-04', '2026-04-07']);
    expect(parsed.skipped.map((s) => s.message).join('\n')).toMatch(/quality check \(flag I\)/);
    expect(parsed.skipped.map((s) => s.message).join('\n')).toMatch(/missing \(-9999\)/);
    expect(parsed.skipped.filter((s) => /left out/.test(s.message))).toHaveLength(2);
  });

  it('sums to the heat sum worked out by hand from the file', () => {
    // 1 Apr (11.2+2.0)/2−5 = 1.6; 2 Apr 5.55; 3 Apr 0; 4 Apr 7.7; 7 Apr 7.0 → 21.85
    expect(accumulate(parsed.days, 5).total).toBe(21.85);
  });

  it('refuses a second station in one file', () => {
    const r = parseTemperatureCsv(`${sample}ZZ000000002,20260408,TMAX,100,,,E,0700\n`);
    expect(r.errors).toEqual([{ line: 17, message: expect.stringMatching(/Another station/) }]);
  });
});

describe('plain date,tmin,tmax', () => {
  it('reads a header and rows, sorted by date', () => {
    const r = parseTemperatureCsv('date,tmin,tmax\n2027-03-02,8,22\n2027-03-01,2.0,11.0\n');
    expect(r.format).toBe('plain');
    expect(r.errors).toEqual([]);
    expect(r.days).toEqual([
      { date: '2027-03-01', tmin: 2, tmax: 11 },
      { date: '2027-03-02', tmin: 8, tmax: 22 },
    ]);
  });

  it('reports every bad row by its line', () => {
    const r = parseTemperatureCsv('date,tmin,tmax\n2027-02-30,1,2\n2027-03-01,5,4\n2027-03-02,x,4\n2027-03-03,1,2\n2027-03-03,1,3\n2027-03-04,1\n');
    expect(r.errors.map((e) => e.line)).toEqual([2, 3, 4, 6, 7]);
    expect(r.errors[1].message).toMatch(/above tmax/);
    expect(r.errors[3].message).toMatch(/already on line 5/);
    expect(r.days.map((d) => d.date)).toEqual(['2027-03-03']);
  });

  it('says so when a file is empty', () => {
    expect(parseTemperatureCsv('').errors[0].message).toMatch(/no days/);
  });
});
