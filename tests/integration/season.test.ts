import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';
import { Fixtures } from './security/fixtures';

const base = inject('baseUrl');
const sample = fs.readFileSync(path.resolve(__dirname, '../fixtures/season/ghcnd-sample-ZZ000000001.csv'), 'utf8');

describe('POST /api/season/degree-days', () => {
  const anon = new Client(base);
  const post = (json: unknown) => anon.json('/api/season/degree-days', 'POST', json);

  it('sums by the simple average method, public and stateless', async () => {
    // source: Alberta Wheat Commission (2019) inputs 23/8 °C base 5 → 10.5; Canola Council of Canada 20/10 base 0 → 15
    const r = await post({
      base: 5,
      days: [
        { date: '2027-03-01', tmin: 8, tmax: 23 },
        { date: '2027-03-02', tmin: -4, tmax: 3 },
      ],
    });
    expect(r.status).toBe(200);
    expect(r.body).toEqual({
      base: 5,
      total: 10.5,
      cumulative: [
        { date: '2027-03-01', gdd: 10.5 },
        { date: '2027-03-02', gdd: 10.5 },
      ],
    });
    expect((await post({ base: 0, days: [{ date: '2027-03-01', tmin: 10, tmax: 20 }] })).body.total).toBe(15);
  });

  it('400 naming the field for bad dates, tmin > tmax, duplicates, disorder and too many days', async () => {
    const d = (date: string, tmin = 1, tmax = 9) => ({ date, tmin, tmax });
    const cases: [unknown, string][] = [
      [{ days: [d('2027-13-01')] }, 'days.0.date'],
      [{ days: [d('2027-03-01', 10, 2)] }, 'days.0.tmin'],
      [{ days: [d('2027-03-01'), d('2027-03-01')] }, 'days.1.date'],
      [{ days: [d('2027-03-02'), d('2027-03-01')] }, 'days.1.date'],
      [{ days: Array.from({ length: 801 }, (_, i) => d(new Date(Date.UTC(2025, 0, 1 + i)).toISOString().slice(0, 10))) }, 'days'],
    ];
    for (const [body, field] of cases) {
      const r = await post(body);
      expect(r.status, field).toBe(400);
      expect(Object.keys(r.body.error.fields), field).toContain(field);
    }
  });
});

describe('temperature records, plans and calendars', () => {
  it('previews a GHCN file with skipped values, refuses members on the club record, imports and re-imports', async () => {
    const member = await signedIn(base, 'member2@candlewise.test');
    expect((await member.json('/api/season/records/preview', 'POST', { scope: 'club', csv: sample })).status).toBe(403);
    const lib = await signedIn(base, 'librarian@candlewise.test');
    const p = await lib.json('/api/season/records/preview', 'POST', { scope: 'club', csv: sample });
    expect(p.status).toBe(200);
    expect(p.body.preview).toMatchObject({ format: 'ghcn', dayCount: 5, heatSum: 21.85, errors: [] });
    expect(p.body.preview.skipped.length).toBeGreaterThanOrEqual(2);
    const bad = await lib.json('/api/season/records/import', 'POST', { scope: 'club', csv: 'date,tmin,tmax\n2026-04-01,9,2\n' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['csv.line.2']);
    const first = await lib.json('/api/season/records/import', 'POST', { scope: 'club', csv: sample });
    expect(first.status).toBe(201);
    const again = await lib.json('/api/season/records/preview', 'POST', { scope: 'club', csv: sample });
    expect(again.body.preview.replaces).toBe(5);
  });

  it('a member’s tree gets a plan from the engine, an observation re-anchors it, and a calendar file', async () => {
    const a = await signedIn(base, 'member@candlewise.test');
    const created = await a.json('/api/trees', 'POST', {
      name: 'Season Scots',
      speciesSlug: 'pinus-sylvestris',
      stageNotes: '',
      containerShape: null,
      containerLengthCm: null,
      containerWidthCm: null,
      acquiredOn: null,
      collectedFromWild: false,
      collectedOn: null,
      notes: '',
    });
    expect(created.status).toBe(201);
    const id = created.body.tree.id;
    const plan = await a.json(`/api/trees/${id}/plan`, 'GET');
    expect(plan.status).toBe(200);
    expect(plan.body.windows.length).toBeGreaterThan(0);
    for (const w of plan.body.windows) {
      expect(Object.keys(w)).toEqual(expect.arrayContaining(['task', 'from', 'to', 'basis', 'reasons']));
      expect(w.from <= w.to).toBe(true);
    }
    expect(['degree-days', 'latitude']).toContain(plan.body.basis);

    const seen = await a.json(`/api/trees/${id}/observations`, 'POST', { date: `${plan.body.seasonStart.slice(0, 4)}-02-20`, shoot: 'candle-extending' });
    expect(seen.status).toBe(201);
    const moved = await a.json(`/api/trees/${id}/plan`, 'GET');
    expect(moved.body.basis).toBe('observed');
    expect(moved.body.timeline.candleStart < plan.body.timeline.candleStart).toBe(true);
    expect((await a.json(`/api/trees/${id}/observations`, 'POST', { shoot: 'candle-extending', task: 'thin' })).status).toBe(422);

    const ics = await a.get(`/api/trees/${id}/plan.ics`);
    expect(ics.status).toBe(200);
    expect(ics.headers.get('content-type')).toMatch(/^text\/calendar/);
    const text = await ics.text();
    expect(text).toMatch(/^BEGIN:VCALENDAR/);
    expect((text.match(/BEGIN:VEVENT/g) ?? []).length).toBe(moved.body.windows.length);

    const b = await signedIn(base, 'member2@candlewise.test');
    expect((await b.json(`/api/trees/${id}/plan`, 'GET')).status).toBe(404);
    expect((await b.get(`/api/trees/${id}/plan.ics`)).status).toBe(404);
    expect((await new Client(base).get(`/api/trees/${id}/plan.ics`)).status).toBe(401);
  });
  it('a plan read again follows at once an import of the member’s own record and a change to the tree', async () => {
    // Plans are kept between visits (lib/data/plan.ts); each of these must still show on the next read.
    const { client: m } = await new Fixtures(base).newMember('plan-memo');
    const body = {
      name: 'Memo Scots',
      speciesSlug: 'pinus-sylvestris',
      stageNotes: '',
      containerShape: null,
      containerLengthCm: null,
      containerWidthCm: null,
      acquiredOn: null,
      collectedFromWild: false,
      collectedOn: null,
      notes: '',
    };
    const created = await m.json('/api/trees', 'POST', body);
    expect(created.status).toBe(201);
    const id = created.body.tree.id;
    const first = await m.json(`/api/trees/${id}/plan`, 'GET');
    expect(first.status).toBe(200);
    expect((await m.json(`/api/trees/${id}/plan`, 'GET')).body).toEqual(first.body);

    // The member's own record, warm from the first of the season to today: the heat sum to date
    // now comes from it, whatever the club record or the latitude gave before.
    const start = first.body.seasonStart as string;
    const today = new Date().toISOString().slice(0, 10); // the server's today, as the plan route uses
    const lines = ['date,tmin,tmax'];
    for (let d = new Date(`${start}T00:00:00Z`); d.toISOString().slice(0, 10) <= today; d.setUTCDate(d.getUTCDate() + 1))
      lines.push(`${d.toISOString().slice(0, 10)},14,26`);
    const imported = await m.json('/api/season/records/import', 'POST', { scope: 'member', csv: lines.join('\n') + '\n' });
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const warm = await m.json(`/api/trees/${id}/plan`, 'GET');
    // Mean 20 °C over the 5 °C base: 15 degree days a day, by the simple average method.
    // source: "Growing degree-days: one equation, two interpretations", Agric. For. Meteorol. 87:291–300 (1997)
    expect(warm.body.degreeDaysToDate).toBeCloseTo(15 * (lines.length - 1), 0);
    expect(warm.body.degreeDaysToDate).not.toBe(first.body.degreeDaysToDate);

    // Marked as collected from the wild today: the plan is worked out for a tree that must recover.
    const edited = await m.json(`/api/trees/${id}`, 'PATCH', { collectedFromWild: true, collectedOn: today });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    const again = await m.json(`/api/trees/${id}/plan`, 'GET');
    expect(again.status).toBe(200);
    expect(again.body.windows).not.toEqual(warm.body.windows);
    expect((await m.json(`/api/trees/${id}/plan`, 'GET')).body).toEqual(again.body);
  });
});
