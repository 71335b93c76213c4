import { describe, expect, it } from 'vitest';
import { dayLengthHours, isEarlySummer, parseIsoDate, resolveHemisphere, resolveLatitude, seasonOf } from '@/lib/wizard/season';

const d = (s: string) => parseIsoDate(s)!;

describe('dates', () => {
  it('accepts real ISO dates only', () => {
    expect(parseIsoDate('2027-02-28')).not.toBeNull();
    expect(parseIsoDate('2027-02-29')).toBeNull();
    expect(parseIsoDate('2028-02-29')).not.toBeNull();
    expect(parseIsoDate('10/05/2027')).toBeNull();
    expect(parseIsoDate('2027-13-01')).toBeNull();
  });
});

describe('season from date and hemisphere', () => {
  // common practice, no published source: meteorological seasons, south shifted six months
  it.each([
    ['2027-01-15', 'winter', 'summer'],
    ['2027-03-01', 'spring', 'autumn'],
    ['2027-05-10', 'spring', 'autumn'],
    ['2027-06-01', 'summer', 'winter'],
    ['2027-08-31', 'summer', 'winter'],
    ['2027-09-01', 'autumn', 'spring'],
    ['2027-10-15', 'autumn', 'spring'],
    ['2027-12-01', 'winter', 'summer'],
  ] as const)('%s is %s in the north and %s in the south', (date, n, s) => {
    expect(seasonOf(d(date), 'north').season).toBe(n);
    expect(seasonOf(d(date), 'south').season).toBe(s);
  });

  it('puts October in mid-spring in the south', () => {
    // common practice, no published source
    const s = seasonOf(d('2027-10-15'), 'south');
    expect(s).toMatchObject({ season: 'spring', monthOfSeason: 2 });
  });

  it('counts the day within the season across the new year', () => {
    expect(seasonOf(d('2027-01-01'), 'north')).toMatchObject({ season: 'winter', monthOfSeason: 2, dayOfSeason: 31 });
    expect(seasonOf(d('2027-07-01'), 'south')).toMatchObject({ season: 'winter', monthOfSeason: 2, dayOfSeason: 30 });
  });

  it('early summer is the first six weeks of summer', () => {
    // common practice, no published source: decandling window
    expect(isEarlySummer(seasonOf(d('2027-06-20'), 'north'))).toBe(true);
    expect(isEarlySummer(seasonOf(d('2027-07-10'), 'north'))).toBe(true);
    expect(isEarlySummer(seasonOf(d('2027-08-05'), 'north'))).toBe(false);
    expect(isEarlySummer(seasonOf(d('2027-05-31'), 'north'))).toBe(false);
    expect(isEarlySummer(seasonOf(d('2027-12-20'), 'south'))).toBe(true);
    expect(isEarlySummer(seasonOf(d('2027-06-20'), 'south'))).toBe(false);
  });
});

describe('which hemisphere applies', () => {
  const club = { hemisphere: 'north' as const, latitude: 45 };
  it('takes an explicit hemisphere over the latitude', () => {
    expect(resolveHemisphere({ hemisphere: 'north', latitude: -33 }, club)).toBe('north');
    expect(resolveHemisphere({ hemisphere: 'south', latitude: 50 }, club)).toBe('south');
  });
  it('takes the latitude sign over the club setting', () => {
    expect(resolveHemisphere({ latitude: -33 }, club)).toBe('south');
    expect(resolveHemisphere({ latitude: 50 }, { ...club, hemisphere: 'south' })).toBe('north');
  });
  it('falls back to the club setting', () => {
    expect(resolveHemisphere({}, { hemisphere: 'south' })).toBe('south');
    expect(resolveHemisphere({}, club)).toBe('north');
  });
  it('gives the latitude the sign of the hemisphere in force', () => {
    expect(resolveLatitude({}, 'south', club)).toBe(-45);
    expect(resolveLatitude({ latitude: 33 }, 'south', club)).toBe(-33);
    expect(resolveLatitude({ latitude: -33 }, 'south', club)).toBe(-33);
  });
});

describe('day length (suncalc) against NOAA check values', () => {
  // source: NOAA solar calculator (Meeus), 0.833° refraction; values from /work/shared/reference/botany-sources.md §5
  it.each([
    [0, '2024-06-20', 12.121],
    [30, '2024-06-20', 14.077],
    [40, '2024-06-20', 15.015],
    [45, '2024-06-20', 15.617],
    [50, '2024-06-20', 16.37],
    [60, '2024-06-20', 18.866],
    [0, '2024-12-21', 12.121],
    [30, '2024-12-21', 10.211],
    [40, '2024-12-21', 9.325],
    [45, '2024-12-21', 8.763],
    [50, '2024-12-21', 8.07],
    [60, '2024-12-21', 5.868],
  ])('%s° N on %s is %s h', (lat, date, hours) => {
    // within 1 minute: NOAA's stated accuracy within ±72°
    expect(Math.abs(dayLengthHours(d(date), lat) - hours)).toBeLessThan(1 / 60);
  });

  it('matches suncalc to the printed value at 45° N', () => {
    // source: botany-sources.md §5, suncalc 1.9.0 at 45° N, 0° E
    expect(dayLengthHours(d('2024-06-20'), 45)).toBeCloseTo(15.6166, 3);
    expect(dayLengthHours(d('2024-12-21'), 45)).toBeCloseTo(8.7631, 3);
  });

  it('mirrors the seasons in the south', () => {
    // source: NOAA check values above, mirrored by symmetry of the solar declination (from memory)
    expect(Math.abs(dayLengthHours(d('2024-12-21'), -45) - 15.617)).toBeLessThan(0.05);
  });

  it('reports polar day and polar night', () => {
    // from memory: at 80° N the sun does not set at the June solstice nor rise at the December one
    expect(dayLengthHours(d('2024-06-20'), 80)).toBe(24);
    expect(dayLengthHours(d('2024-12-21'), 80)).toBe(0);
  });
});
