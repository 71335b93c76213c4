import matter from 'gray-matter';
import YAML from 'yaml';
import type { FieldErrors } from '@/lib/errors';
import { speciesFieldErrors, yamlProblems } from './file-messages';
import { missingCitations, speciesRecordSchema, type SpeciesRecord } from '@/lib/validation/species';
import { markdownProblem } from '@/lib/markdown/limits';

// A species file is YAML front matter (the species record) and a Markdown body (care notes).
// Parsing never throws: a broken file comes back with its errors per field, so the import
// preview and the seeder can report them and write nothing.

export const SPECIES_CONTENT_DIR = 'content/species';
const MAX_BODY_CHARS = 40_000;

export type ParsedSpecies = { ok: true; record: SpeciesRecord; body: string } | { ok: false; message: string; fields: FieldErrors };

class FrontMatterError extends Error {
  constructor(readonly problems: string[]) {
    super(problems.join(' '));
  }
}

const matterOptions = {
  // YAML 1.2 through `yaml` (no implicit dates or other surprises); passing options also
  // keeps gray-matter from caching and sharing parsed objects between calls. Every syntax
  // error is kept, not just the first.
  engines: {
    yaml: (s: string) => {
      const doc = YAML.parseDocument(s);
      if (doc.errors.length) throw new FrontMatterError(yamlProblems(doc.errors, s));
      return doc.toJS() as object;
    },
  },
  language: 'yaml',
};

export function parseSpeciesMarkdown(source: string): ParsedSpecies {
  let data: unknown;
  let body: string;
  if (!/^\uFEFF?---\r?\n/.test(source)) {
    return { ok: false, message: 'The file has no front matter.', fields: { frontMatter: ['Start the file with a --- front matter block.'] } };
  }
  try {
    const parsed = matter(source.replace(/^\uFEFF/, ''), matterOptions);
    data = parsed.data;
    body = parsed.content.replace(/^\r?\n/, '').trimEnd();
  } catch (e) {
    const problems = e instanceof FrontMatterError ? e.problems : ['The front matter could not be read: check that it is YAML between two --- lines.'];
    return { ok: false, message: 'The front matter is not valid YAML.', fields: { frontMatter: problems } };
  }
  if (body.length > MAX_BODY_CHARS) {
    return { ok: false, message: 'The care notes are too long.', fields: { body: [`Keep the care notes under ${MAX_BODY_CHARS} characters.`] } };
  }
  const problem = markdownProblem(body);
  if (problem) return { ok: false, message: 'The care notes cannot be shown.', fields: { body: [problem] } };
  const result = speciesRecordSchema.safeParse(data);
  if (!result.success) return { ok: false, message: 'Some fields are not valid.', fields: speciesFieldErrors(result.error, data) };
  // A species file is published content: every published value carries its citation.
  const uncited = missingCitations(result.data);
  if (Object.keys(uncited).length) return { ok: false, message: 'Some published values have no citation.', fields: uncited };
  return { ok: true, record: result.data, body: body + (body ? '\n' : '') };
}

/** The same format back: front matter in a stable key order, then the body. */
export function serializeSpeciesMarkdown(record: SpeciesRecord, body: string): string {
  const front = YAML.stringify(record, { lineWidth: 0 }).trimEnd();
  const notes = body.trim();
  return `---\n${front}\n---\n\n${notes}${notes ? '\n' : ''}`;
}

/** The searchable columns of the `species` table, taken from a (published) record. */
export function speciesColumns(record: SpeciesRecord) {
  return {
    slug: record.slug,
    botanicalName: record.botanicalName,
    commonNames: record.commonNames,
    synonyms: record.synonyms,
    genus: record.genus,
    group: record.group,
    flushHabit: record.traits.flushHabit.value,
    vigour: record.traits.vigour.value,
    needleMinMm: record.traits.needleLengthMm.value.min,
    needleMaxMm: record.traits.needleLengthMm.value.max,
  };
}
