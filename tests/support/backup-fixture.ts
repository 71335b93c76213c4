import { sql } from 'drizzle-orm';
import type { Db } from '@/db/open';
import {
  answers,
  digestSends,
  jobs,
  noteLinks,
  notes,
  outboxMessages,
  pendingSignUps,
  photos,
  rateLimits,
  reminderRunMembers,
  reminderRuns,
  reminderSends,
  species,
  speciesRevisions,
  temperatureDays,
  temperatureRecords,
  treeObservations,
  trees,
  users,
  verificationTokens,
} from '@/db/schema';

// Rows in every table, with the values a dump most easily gets wrong: quotes, backslashes,
// newlines, non-Latin text, emoji, JSON with nesting and escapes, NULLs, fractional floats,
// timestamps with milliseconds, dates, booleans, and serial ids with gaps.
// jsonb of any shape, as an older version of the app might have written it: the columns are typed
// for what the app writes now, and a dump must carry whatever is there.
const anyJson = (value: unknown) => value as never;

const awkward = `O'Brien "quoted" back\\slash\nnew line\ttab — ñ 松 🌲 $$ ; -- not a comment`;

export async function fillAwkwardRows(db: Db) {
  await db.insert(users).values([
    { id: 'u-awkward-1', email: 'awkward1@candlewise.test', name: awkward, role: 'member', digestOptIn: true },
    { id: 'u-awkward-2', email: 'awkward2@candlewise.test', name: null, role: 'editor', disabled: true, tokenVersion: 7 },
  ]);
  const [sp] = await db
    .insert(species)
    .values({
      slug: 'pinus-awkwardii',
      botanicalName: 'Pinus awkwardii',
      commonNames: [awkward, 'plain'],
      synonyms: [],
      genus: 'Pinus',
      group: 'two-needle',
      flushHabit: 'single',
      vigour: 'high',
      needleMinMm: 0.1,
      needleMaxMm: 123.456,
      publishedRevision: 2,
      latestRevision: 2,
    })
    .returning({ id: species.id });
  await db.insert(speciesRevisions).values([
    {
      speciesId: sp.id,
      revision: 1,
      status: 'draft',
      data: anyJson({ nested: { a: [1, 2.5, null, true] }, s: awkward }),
      body: awkward,
      editorId: 'u-awkward-2',
    },
    {
      speciesId: sp.id,
      revision: 2,
      status: 'published',
      data: anyJson({ unicode: '\u00e9\u4e2d', empty: {} }),
      body: '# Heading\n\n|a|b|\n|-|-|',
      summary: 'two',
    },
  ]);
  await db.insert(trees).values({
    id: 'tree-awkward',
    ownerId: 'u-awkward-1',
    name: awkward,
    speciesSlug: 'pinus-awkwardii',
    containerShape: 'oval',
    containerLengthCm: 33.3,
    containerWidthCm: null,
    acquiredOn: '2019-02-28',
    collectedFromWild: true,
    collectedOn: '2018-10-01',
  });
  await db.insert(temperatureRecords).values({ id: 'rec-awkward', scopeKey: 'club', ownerId: null, name: awkward });
  await db.insert(temperatureDays).values([
    { recordId: 'rec-awkward', day: '2027-03-01', tmin: -2.5, tmax: 11.3 },
    { recordId: 'rec-awkward', day: '2027-03-02', tmin: 0.1, tmax: 9.9 },
  ]);
  await db.insert(treeObservations).values({ treeId: 'tree-awkward', ownerId: 'u-awkward-1', observedOn: '2027-04-20', shoot: 'candle-extending', task: null });
  await db.insert(answers).values([
    {
      id: 'ans-awkward-1',
      userId: 'u-awkward-1',
      treeId: 'tree-awkward',
      speciesSlug: 'pinus-awkwardii',
      speciesRevision: 2,
      engineVersion: '1.0.0',
      action: 'decandle',
      stage: 'refinement',
      season: 'summer',
      observedOn: '2026-06-21',
      input: anyJson({ quote: "it's", backslash: 'a\\b', list: [{ x: 1 }] }),
      result: anyJson({ reasons: [awkward] }),
      note: awkward,
      visibility: 'club',
      createdAt: new Date('2026-06-21T10:11:12.345Z'),
    },
    {
      id: 'ans-awkward-2',
      userId: 'u-awkward-1',
      treeId: null,
      speciesSlug: 'pinus-awkwardii',
      speciesRevision: 1,
      engineVersion: '1.0.0',
      action: 'wait',
      stage: 'development',
      season: 'winter',
      observedOn: '2025-12-31',
      input: anyJson({}),
      result: anyJson({}),
      createdAt: new Date('2025-12-31T23:59:59.999Z'),
    },
  ]);
  const [note] = await db
    .insert(notes)
    .values({
      slug: 'awkward-meeting',
      title: awkward,
      meetingDate: '2026-03-14',
      body: `See [answer](/answers/ans-awkward-1)\n\n${awkward}`,
      status: 'published',
      authorId: 'u-awkward-2',
      publishedAt: new Date('2026-03-15T08:00:00.000Z'),
    })
    .returning({ id: notes.id });
  await db.insert(noteLinks).values([
    { noteId: note.id, targetType: 'answer', targetId: 'ans-awkward-1', meetingDate: '2026-03-14', published: true },
    { noteId: note.id, targetType: 'species', targetId: 'pinus-awkwardii', meetingDate: '2026-03-14', published: true },
  ]);
  await db.insert(digestSends).values({ noteId: note.id, senderId: 'u-awkward-2', recipients: 3 });
  await db.insert(photos).values({
    id: 'photo-awkward',
    ownerId: 'u-awkward-1',
    answerId: 'ans-awkward-1',
    treeId: 'tree-awkward',
    storageKey: 'ab/cd.webp',
    thumbKey: 'ab/cd-thumb.webp',
    mime: 'image/webp',
    width: 1200,
    height: 800,
    bytes: 123456,
  });
  // Serial ids with a gap: the restored sequence must continue after the highest id, not fill it.
  for (let i = 0; i < 3; i++) {
    await db.insert(outboxMessages).values({ envelopeFrom: 'a@candlewise.test', envelopeTo: ['b@candlewise.test'], subject: awkward, raw: awkward });
  }
  await db.delete(outboxMessages).where(sql`${outboxMessages.id} = (select min(id) from outbox_messages)`);
  await db.insert(verificationTokens).values({ identifier: 'awkward1@candlewise.test', token: 'hashed-token', expires: new Date('2026-12-02T06:00:00.000Z') });
  await db.insert(pendingSignUps).values({
    tokenHash: 'a'.repeat(64),
    email: 'awkward3@candlewise.test',
    name: awkward,
    passwordHash: '$2b$10$notarealhashnotarealhashnotarealhashnotarealhashnot',
    expiresAt: new Date('2026-12-03T06:00:00.123Z'),
  });
  await db
    .insert(jobs)
    .values({ queue: 'reminders.member', payload: { runId: 'run-awkward', note: awkward, nested: { a: [1, null] } }, lastError: awkward, dedupeKey: awkward });
  await db.insert(reminderRuns).values({ id: 'run-awkward', weekOf: '2027-05-10', requestedBy: 'u-awkward-2', total: 1 });
  await db.insert(reminderRunMembers).values({ runId: 'run-awkward', userId: 'u-awkward-1', outcome: 'sent', reason: null });
  await db.insert(reminderSends).values({
    weekOf: '2027-05-10',
    userId: 'u-awkward-1',
    runId: 'run-awkward',
    state: 'sent',
    messageId: '<reminder.awkward@candlewise.test>',
    tasks: 2,
    reason: awkward,
  });
  // Limiter counts are short-lived, but a dump carries them like any row (a key can be any text).
  await db.insert(rateLimits).values({
    key: `e:${awkward}`,
    windowStart: new Date('2026-12-03T06:01:00.000Z'),
    hits: 7,
    expiresAt: new Date('2026-12-03T06:03:00.000Z'),
  });
}
