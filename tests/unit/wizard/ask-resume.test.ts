import { describe, expect, it } from 'vitest';
import { bootPlan, resumeQuestion, type StoredRun } from '@/lib/wizard/ask-resume';

const run: StoredRun = { answers: { species: 'pinus-sylvestris', health: 'average', date: '2027-05-15' }, step: 'shoot', updatedAt: '2027-05-15T09:30:00Z' };

describe('when /ask offers an unfinished run', () => {
  it('starts fresh from any start link, even with a run kept', () => {
    expect(bootPlan({ stored: run, freshIntent: true, stepInUrl: false })).toBe('fresh');
    expect(bootPlan({ stored: run, freshIntent: true, stepInUrl: true })).toBe('fresh');
  });
  it('offers the run to a member who comes back without one, and carries on after a reload', () => {
    expect(bootPlan({ stored: run, freshIntent: false, stepInUrl: false })).toBe('offer');
    expect(bootPlan({ stored: run, freshIntent: false, stepInUrl: true })).toBe('resume');
  });
  it('offers nothing when there is nothing worth continuing', () => {
    expect(bootPlan({ stored: null, freshIntent: false, stepInUrl: false })).toBe('fresh');
    expect(bootPlan({ stored: { ...run, answers: { date: '2027-05-15' } }, freshIntent: false, stepInUrl: false })).toBe('fresh');
    expect(bootPlan({ stored: { answers: null } as unknown as StoredRun, freshIntent: false, stepInUrl: false })).toBe('fresh');
  });
  it('names the species and the day of the run', () => {
    const name = (slug: string) => (slug === 'pinus-sylvestris' ? 'Scots pine' : undefined);
    expect(resumeQuestion(run, name)).toBe('Continue with Scots pine, 15 May?');
    expect(resumeQuestion({ ...run, updatedAt: '2027-05-15T23:30:00Z' }, name, 'Pacific/Auckland')).toBe('Continue with Scots pine, 16 May?');
    expect(resumeQuestion({ ...run, answers: { species: 'pinus-gone' } }, name)).toBe('Continue with your last tree, 15 May?');
  });
});
