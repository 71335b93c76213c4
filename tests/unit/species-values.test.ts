import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { readSpeciesDir } from '@/lib/species/content-dir';
import type { SpeciesRecord } from '@/lib/validation/species';
import { speciesGroups, toWizardSpecies } from '@/lib/validation/species';

const records = new Map<string, SpeciesRecord>(
  readSpeciesDir(path.resolve(__dirname, '../../content/species')).flatMap((f) => (f.result.ok ? [[f.result.record.slug, f.result.record] as const] : [])),
);
const get = (slug: string) => {
  const r = records.get(slug);
  if (!r) throw new Error(`missing ${slug}`);
  return r.traits;
};

describe('shipped species values against their sources', () => {
  it('Scots pine: 2 needles, 30–70 mm', () => {
    const t = get('pinus-sylvestris');
    expect(t.needlesPerFascicle.value).toBe(2); // source: Flora Europaea vol. 1
    expect(t.needleLengthMm.value).toEqual({ min: 30, max: 70 }); // source: Flora Europaea vol. 1
    expect(t.needleLengthMm.citation).toMatch(/Flora Europaea/);
  });

  it('Japanese white pine: 5 needles', () => {
    expect(get('pinus-parviflora').needlesPerFascicle.value).toBe(5); // source: Flora of China vol. 4
    expect(get('pinus-parviflora').needlesPerFascicle.citation).toMatch(/Flora of China vol\. 4/);
  });

  it('Japanese black pine: spring shoots uninodal', () => {
    expect(get('pinus-thunbergii').shootHabit.value).toBe('uninodal'); // source: Shaw 1914
    expect(get('pinus-thunbergii').shootHabit.citation).toMatch(/Shaw 1914/);
  });

  it('lodgepole pine: spring shoots multinodal', () => {
    expect(get('pinus-contorta').shootHabit.value).toBe('multinodal'); // source: Shaw 1914
  });

  it('Japanese black pine needles 60–120 mm', () => {
    expect(get('pinus-thunbergii').needleLengthMm.value).toEqual({ min: 60, max: 120 }); // source: Flora of China vol. 4
  });

  it('Scots pine is a single-flush pine', () => {
    expect(get('pinus-sylvestris').flushHabit.value).toBe('single'); // common practice, no published source
    expect(get('pinus-sylvestris').flushHabit.provenance).toBe('common-practice');
  });

  it('Japanese black and Japanese red pine are double-flush; the other pines single', () => {
    expect(get('pinus-thunbergii').flushHabit.value).toBe('double'); // common practice, no published source
    expect(get('pinus-densiflora').flushHabit.value).toBe('double'); // common practice, no published source
    for (const slug of ['pinus-mugo', 'pinus-parviflora']) expect(get(slug).flushHabit.value).toBe('single'); // common practice, no published source
  });

  it('lodgepole, jack and Aleppo pine are polycyclic, with their botanical shoot habit kept beside it', () => {
    for (const slug of ['pinus-contorta', 'pinus-banksiana', 'pinus-halepensis']) {
      expect(get(slug).flushHabit.value, slug).toBe('polycyclic');
      expect(get(slug).shootHabit.value, slug).toBe('multinodal'); // source: Shaw 1914 (contorta); Ann. For. Sci. 2017 (halepensis); from memory (banksiana)
      expect(toWizardSpecies(records.get(slug)!, 1), slug).toMatchObject({ flushHabit: 'polycyclic', shootHabit: 'multinodal' });
    }
  });

  it('mugo pine needles lengthen strongly with spring feeding; Scots pine only slightly', () => {
    expect(get('pinus-mugo').feedingNeedleResponse.value).toBe('strong'); // common practice, no published source
    expect(get('pinus-sylvestris').feedingNeedleResponse.value).toBe('slight'); // common practice, no published source
  });

  it('keeps flush habit and shoot habit apart: a double-flush pine can be uninodal', () => {
    const w = toWizardSpecies(records.get('pinus-thunbergii')!, 1);
    expect(w).toMatchObject({ flushHabit: 'double', shootHabit: 'uninodal' });
  });

  it('marks trade-only traits as common practice, never as published', () => {
    for (const rec of records.values()) {
      expect(['common-practice', 'from-memory'], rec.slug).toContain(rec.traits.flushHabit.provenance);
    }
  });

  it('cautions about invasive spread where planted out, for the species known for it', () => {
    for (const slug of ['pinus-contorta', 'pinus-sylvestris', 'pinus-nigra', 'pinus-halepensis', 'pinus-pinaster']) {
      expect(
        records
          .get(slug)!
          .cautions.map((c) => c.text)
          .join(' '),
        slug,
      ).toMatch(/planted out/);
    }
  });

  it('ships at least 60 species, with every group the wizard models', () => {
    expect(records.size).toBeGreaterThanOrEqual(60);
    const groups = new Set([...records.values()].map((r) => r.group));
    for (const g of speciesGroups) expect(groups, g).toContain(g);
    for (const slug of ['larix-decidua', 'picea-abies', 'juniperus-chinensis']) expect(records.has(slug)).toBe(true);
  });
});
