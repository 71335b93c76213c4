import { diffWordsWithSpace } from 'diff';
import { groupLabels, formatTraitValue, traitLabels, traitOrder } from '@/lib/species/labels';
import { sourceLabel, type SpeciesRecord } from '@/lib/validation/species';

// What changed between two revisions of a species, in words an editor reads: one line per
// trait or field that changed, and a word-level diff of the care notes.

export interface FieldChange {
  /** Which field, as the form labels it. */
  field: string;
  /** "Vigour: Moderate → High; source: common practice → Flora of China vol. 4". */
  text: string;
}

export interface BodyPart {
  kind: 'same' | 'added' | 'removed';
  value: string;
}

export interface RevisionDiff {
  changes: FieldChange[];
  body: BodyPart[];
  bodyChanged: boolean;
  same: boolean;
}

const arrow = (a: string, b: string) => `${a} → ${b}`;
const list = (xs: string[]) => (xs.length ? xs.join(', ') : 'none');

function sourceOf(t: { provenance: SpeciesRecord['traits']['vigour']['provenance']; citation?: string }) {
  // A published value still waiting for its citation reads as such, not as "published".
  return t.provenance === 'published' && !t.citation ? 'published, citation to come' : sourceLabel(t);
}

export function recordChanges(a: SpeciesRecord, b: SpeciesRecord): FieldChange[] {
  const out: FieldChange[] = [];
  const plain = (field: string, x: string, y: string) => {
    if (x !== y) out.push({ field, text: `${field}: ${arrow(x || 'none', y || 'none')}` });
  };
  plain('Botanical name', a.botanicalName, b.botanicalName);
  plain('Genus', a.genus, b.genus);
  plain('Group', groupLabels[a.group] ?? a.group, groupLabels[b.group] ?? b.group);
  plain('Common names', list(a.commonNames), list(b.commonNames));
  plain('Synonyms', list(a.synonyms), list(b.synonyms));

  for (const key of traitOrder) {
    const x = a.traits[key];
    const y = b.traits[key];
    const parts: string[] = [];
    const vx = formatTraitValue(key, x.value);
    const vy = formatTraitValue(key, y.value);
    if (vx !== vy) parts.push(arrow(vx, vy));
    const sx = sourceOf(x);
    const sy = sourceOf(y);
    if (sx !== sy) parts.push(`source: ${arrow(sx, sy)}`);
    if ((x.note ?? '') !== (y.note ?? '')) parts.push(`note: ${arrow(x.note || 'none', y.note || 'none')}`);
    if (parts.length) {
      // Without a value change the value is named once, so the line still says what it is about.
      const head = vx === vy ? `${vx}; ` : '';
      out.push({ field: traitLabels[key], text: `${traitLabels[key]}: ${head}${parts.join('; ')}` });
    }
  }

  const cautionText = (c: SpeciesRecord['cautions'][number]) => `“${c.text}” (${sourceOf(c)})`;
  const before = a.cautions.map(cautionText);
  const after = b.cautions.map(cautionText);
  for (const c of before) if (!after.includes(c)) out.push({ field: 'Cautions', text: `Caution removed: ${c}` });
  for (const c of after) if (!before.includes(c)) out.push({ field: 'Cautions', text: `Caution added: ${c}` });
  return out;
}

/**
 * A word-level diff of the care notes. The Markdown stays as written (a list bullet is a
 * character of the text, never a diff marker), added and removed words are marked in place.
 */
export function bodyDiff(a: string, b: string): BodyPart[] {
  return diffWordsWithSpace(a, b).map((p) => ({ kind: p.added ? 'added' : p.removed ? 'removed' : 'same', value: p.value }));
}

export function sameContent(a: { record: SpeciesRecord; body: string }, b: { record: SpeciesRecord; body: string }): boolean {
  return recordChanges(a.record, b.record).length === 0 && a.body === b.body;
}

export function revisionDiff(a: { record: SpeciesRecord; body: string }, b: { record: SpeciesRecord; body: string }): RevisionDiff {
  const changes = recordChanges(a.record, b.record);
  const bodyChanged = a.body !== b.body;
  return { changes, body: bodyChanged ? bodyDiff(a.body, b.body) : [], bodyChanged, same: changes.length === 0 && !bodyChanged };
}
