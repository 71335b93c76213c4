import 'server-only';
import { and, eq } from 'drizzle-orm';
import type { Db } from './open';
import { answers, notes, species, speciesRevisions, trees, users } from './schema';
import { evaluate } from '@/lib/wizard/engine';
import type { WizardInput } from '@/lib/wizard/types';
import { speciesRecordSchema, toWizardSpecies } from '@/lib/validation/species';
import { rewriteNoteLinks } from '@/lib/data/notes';
import { answerRowFromResult } from '@/lib/data/answer-row';

// Demo content for the invented Riverside Pine Study Group: two trees kept by the demo member,
// one answer about the first (shared with the club), and a published meeting note by the
// librarian that links that answer and a species. Fixed ids make the seeder idempotent.

export const demoTreeIds = { scots: 'demoTreeWeirScots', mugo: 'demoTreeMillMugo' } as const;
export const demoAnswerId = 'demoAnsWeirScots1';
export const demoNoteSlug = '2026-04-18-spring-candle-evening';

async function userId(db: Db, email: string): Promise<string | null> {
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
  return u?.id ?? null;
}

async function wizardSpecies(db: Db, slug: string) {
  const [row] = await db
    .select({ data: speciesRevisions.data, revision: speciesRevisions.revision })
    .from(species)
    .innerJoin(speciesRevisions, and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.publishedRevision)))
    .where(eq(species.slug, slug))
    .limit(1);
  if (!row) return null;
  return toWizardSpecies(speciesRecordSchema.parse(row.data), row.revision);
}

export async function seedRecord(db: Db) {
  const member = await userId(db, 'member@candlewise.test');
  const librarian = await userId(db, 'librarian@candlewise.test');
  const scots = await wizardSpecies(db, 'pinus-sylvestris');
  if (!member || !librarian || !scots || !(await wizardSpecies(db, 'pinus-mugo'))) return;

  await db
    .insert(trees)
    .values([
      {
        id: demoTreeIds.scots,
        ownerId: member,
        name: 'Weir-side Scots',
        speciesSlug: 'pinus-sylvestris',
        stageNotes: 'Primary and secondary branching set on the lower pads; the apex is still building tertiaries.',
        containerShape: 'rectangle',
        containerLengthCm: 40,
        containerWidthCm: 30,
        acquiredOn: '2019-05-04',
        collectedFromWild: false,
        notes: 'Nursery stock, first styled at the club workshop. Repotted into the brown rectangle in spring 2024.',
      },
      {
        id: demoTreeIds.mugo,
        ownerId: member,
        name: 'Mill-race mugo',
        speciesSlug: 'pinus-mugo',
        stageNotes: 'Collected with the landowner’s written permission; left to grow and rebuild roots.',
        containerShape: 'oval',
        containerLengthCm: 36,
        containerWidthCm: 26,
        acquiredOn: '2025-10-11',
        collectedFromWild: true,
        collectedOn: '2025-10-11',
        notes: 'Watch the needle length: feed lightly in spring.',
      },
    ])
    .onConflictDoNothing({ target: trees.id });

  const input: WizardInput = {
    species: 'pinus-sylvestris',
    branching: 'tertiary',
    date: '2026-04-12',
    hemisphere: 'north',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'strong',
    container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 },
  };
  const result = evaluate(input, scots, { hemisphere: 'north', latitude: 45.5, today: '2026-04-12' });
  await db
    .insert(answers)
    .values({
      id: demoAnswerId,
      userId: member,
      treeId: demoTreeIds.scots,
      ...answerRowFromResult(input, result),
      note: 'Top pad candles past the silhouette.',
      followUp: 'Pinched on 12 April; the buds behind extended by early May and were pinched again.',
      visibility: 'club',
      createdAt: new Date('2026-04-12T17:30:00Z'),
    })
    .onConflictDoNothing({ target: answers.id });

  const body = [
    'Eleven members came; the river was high, so we met in the hall.',
    '',
    '## Pinching in refinement',
    '',
    `Wren showed [the pinch on the Weir-side Scots](/answers/${demoAnswerId}): candles past the silhouette,`,
    'pinched while still soft single cylinders, leaving part of each candle. The buds behind came two to three',
    'weeks later and were pinched in turn.',
    '',
    'On a single-flush pine such as [Scots pine](/species/pinus-sylvestris) the candle is never removed whole.',
    'The double-flush [Japanese black pine](/species/pinus-thunbergii) is a different story, for June.',
    '',
    '## Feeding',
    '',
    '- Four piles of pellets on a 40 × 30 cm pot, halfway between trunk and rim.',
    '- Keep pets and children away from the pellets; wear gloves.',
    '',
    'Next meeting: decandling demonstration.',
  ].join('\n');
  const [note] = await db
    .insert(notes)
    .values({
      slug: demoNoteSlug,
      title: 'Spring candle evening',
      meetingDate: '2026-04-18',
      body,
      status: 'published',
      authorId: librarian,
      createdAt: new Date('2026-04-19T09:00:00Z'),
      updatedAt: new Date('2026-04-19T09:00:00Z'),
      publishedAt: new Date('2026-04-19T09:00:00Z'),
    })
    .onConflictDoNothing({ target: notes.slug })
    .returning({ id: notes.id });
  if (note) await rewriteNoteLinks(db, note.id, body);
}
