import { containerShapeLabels, type ContainerShape } from '@/lib/validation/trees';

// Plain-words descriptions of a tree's fields, shared by the table, the tree page and the seeder's checks.

export function describeContainer(t: { containerShape: ContainerShape | null; containerLengthCm: number | null; containerWidthCm: number | null }): string {
  if (!t.containerShape || t.containerLengthCm == null) return 'Not given';
  const fmt = (n: number) => (Number.isInteger(n) ? String(n) : n.toFixed(1));
  if (t.containerShape === 'round') return `${containerShapeLabels.round}, ${fmt(t.containerLengthCm)} cm across`;
  return `${containerShapeLabels[t.containerShape]}, ${fmt(t.containerLengthCm)} × ${fmt(t.containerWidthCm ?? t.containerLengthCm)} cm`;
}

export function describeCollected(t: { collectedFromWild: boolean; collectedOn: string | null }): string {
  if (!t.collectedFromWild) return 'No';
  return t.collectedOn ? `Yes, ${t.collectedOn}` : 'Yes';
}

const TWO_YEARS_MS = 2 * 365.25 * 24 * 3600 * 1000;

/** Collected from the wild with no date, or within the last two years: the engine's recovery case. */
export function isRecentlyCollected(t: { collectedFromWild: boolean; collectedOn: string | null }, today: string): boolean {
  if (!t.collectedFromWild) return false;
  if (!t.collectedOn) return true;
  return Date.parse(today) - Date.parse(t.collectedOn) < TWO_YEARS_MS;
}

/**
 * Query parameters that start the wizard pre-filled from a tree: `tree`, `species`, the container
 * (`shape`, `lengthCm`, `widthCm`), `collected` (`1` when collected from the wild within the
 * last two years, the wizard's recently-collected question) and `collectedOn` when known.
 */
export function askParamsFor(
  t: {
    id: string;
    speciesSlug: string;
    containerShape: ContainerShape | null;
    containerLengthCm: number | null;
    containerWidthCm: number | null;
    collectedFromWild: boolean;
    collectedOn: string | null;
  },
  today: string,
): URLSearchParams {
  const p = new URLSearchParams({ tree: t.id, species: t.speciesSlug });
  if (t.containerShape && t.containerLengthCm != null) {
    p.set('shape', t.containerShape);
    p.set('lengthCm', String(t.containerLengthCm));
    if (t.containerShape !== 'round' && t.containerWidthCm != null) p.set('widthCm', String(t.containerWidthCm));
  }
  p.set('collected', isRecentlyCollected(t, today) ? '1' : '0');
  if (t.collectedFromWild && t.collectedOn) p.set('collectedOn', t.collectedOn);
  return p;
}
