import type { ZodError } from 'zod';
import type { YAMLError } from 'yaml';
import type { FieldErrors } from '@/lib/errors';
import { traitLabels } from './labels';

// Messages for an editor who uploaded a species file: each names the field in words, says what
// was found and what would do instead. zod's and yaml's own wording ("Invalid option: expected one
// of "pine"|"larch"|…", a YAML message cut at its first line) is for developers.

const fieldWords: Record<string, string> = {
  slug: 'Slug',
  botanicalName: 'Botanical name',
  commonNames: 'Common names',
  synonyms: 'Other names',
  genus: 'Genus',
  group: 'Group',
  cautions: 'Cautions',
  traits: 'Traits',
};
const partWords: Record<string, string> = {
  value: 'value',
  provenance: 'source kind',
  citation: 'citation',
  note: 'note',
  min: 'lowest',
  max: 'highest',
  text: 'text',
};

/** `traits.flushHabit.value` → "Flush habit (trade), value"; `commonNames.2` → "Common names, entry 3". */
function fieldLabel(path: readonly PropertyKey[]): string {
  const [head, ...rest] = path.map(String);
  if (head === undefined) return 'The file';
  let label = fieldWords[head] ?? head;
  if (head === 'traits' && rest[0]) label = traitLabels[rest.shift() as keyof typeof traitLabels] ?? label;
  for (const p of rest) label += /^\d+$/.test(p) ? `, entry ${Number(p) + 1}` : `, ${partWords[p] ?? p}`;
  return label;
}

function at(data: unknown, path: readonly PropertyKey[]): unknown {
  let v = data;
  for (const p of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[p];
  }
  return v;
}

function shown(v: unknown): string {
  if (typeof v === 'string') return `“${v.length > 60 ? `${v.slice(0, 57)}…` : v}”`;
  if (v === null) return 'an empty value';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a group of fields';
  return String(v);
}

const kindWords: Record<string, string> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  boolean: 'yes or no',
  array: 'a list',
  object: 'a group of fields',
};

function orList(values: readonly unknown[]): string {
  const words = values.map(String);
  return words.length <= 1 ? words.join('') : `${words.slice(0, -1).join(', ')} or ${words[words.length - 1]}`;
}

// zod's default messages all begin like this; a schema's own message (a sentence for people) is kept.
const ZOD_DEFAULT = /^(Invalid|Too (small|big)|Unrecognized key|Expected)/;

/** A zod error on a species record as `{ 'path.to.field': [sentences] }`, every problem listed. */
export function speciesFieldErrors(error: ZodError, data: unknown): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : 'frontMatter';
    const label = fieldLabel(issue.path);
    const found = at(data, issue.path);
    let text: string;
    if (!ZOD_DEFAULT.test(issue.message)) {
      text = `${label}: ${issue.message}`;
    } else if (issue.code === 'invalid_value') {
      const values = (issue as { values: readonly unknown[] }).values;
      text = `${label}: ${shown(found)} is not one of the choices. Use ${orList(values)}.`;
    } else if (issue.code === 'invalid_type') {
      const expected = kindWords[(issue as { expected: string }).expected] ?? (issue as { expected: string }).expected;
      text = found === undefined ? `${label} is missing: add it as ${expected}.` : `${label}: expected ${expected}, found ${shown(found)}.`;
    } else if (issue.code === 'too_small' || issue.code === 'too_big') {
      const { origin } = issue as { origin?: string };
      const limit = Number((issue as { minimum?: number | bigint; maximum?: number | bigint }).minimum ?? (issue as { maximum?: number | bigint }).maximum);
      const small = issue.code === 'too_small';
      if (origin === 'string')
        text = small
          ? limit <= 1
            ? `${label} is empty: write something or leave the field out.`
            : `${label} is too short: at least ${limit} characters.`
          : `${label} is too long: at most ${limit} characters.`;
      else if (origin === 'array') text = small ? `${label}: give at least ${limit}.` : `${label}: at most ${limit} entries.`;
      else text = `${label}: ${shown(found)} is too ${small ? 'small' : 'large'}; it must be ${small ? 'at least' : 'at most'} ${limit}.`;
    } else if (issue.code === 'invalid_format') {
      text = `${label}: ${shown(found)} is not in the expected form.`;
    } else {
      text = `${label}: this value cannot be used (${issue.message.replace(/^Invalid input:?\s*/, '') || 'check the spelling'}).`;
    }
    (out[key] ??= []).push(text);
  }
  return out;
}

/**
 * Every YAML syntax error of the front matter, each with its line in the file, the reason in full
 * and the offending line. The front matter comes after the opening --- line, with or without the
 * line break that ends it.
 */
export function yamlProblems(errors: readonly YAMLError[], frontMatter: string): string[] {
  const lines = frontMatter.split(/\r?\n/);
  const offset = /^\r?\n/.test(frontMatter) ? 0 : 1;
  return errors.map((e) => {
    const reason = e.message
      .split(/ at line \d+, column \d+/)[0]
      .split('\n')[0]
      .trim()
      .replace(/\.?$/, '.');
    const pos = e.linePos?.[0];
    if (!pos) return reason;
    const source = lines[pos.line - 1]?.trim();
    return `Line ${pos.line + offset}, column ${pos.col}: ${reason}${source ? ` The line reads: ${source.length > 80 ? `${source.slice(0, 77)}…` : source}` : ''}`;
  });
}
