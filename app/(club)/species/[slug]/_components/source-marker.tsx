import { provenanceLabels } from '@/lib/species/labels';
import type { ProvenanceKind } from '@/lib/validation/species';

const tone: Record<ProvenanceKind, string> = {
  published: 'border-moss-600 bg-moss-50 text-moss-800',
  'common-practice': 'border-bark-500 bg-bark-50 text-bark-800',
  'from-memory': 'border-stone-500 bg-stone-100 text-stone-800',
};

/**
 * A small source marker beside a value. The citation shows on hover and on keyboard focus (the
 * marker is a focusable button described by the tooltip), so it works without a mouse. The tip is
 * display:none until then; on a phone it shows pinned across the bottom of the screen, so a
 * marker near the right edge never pushes it past the screen.
 */
export function SourceMarker({
  id,
  provenance,
  citation,
  note,
  sourceNumber,
  align = 'start',
}: {
  id: string;
  provenance: ProvenanceKind;
  citation?: string;
  note?: string;
  sourceNumber?: number;
  align?: 'start' | 'end';
}) {
  const label = provenanceLabels[provenance];
  const tipId = `${id}-tip`;
  return (
    <span className="group relative inline-block align-middle">
      <button
        type="button"
        aria-describedby={tipId}
        aria-label={`Source: ${label.long}${sourceNumber ? `, source ${sourceNumber}` : ''}`}
        // The badge stays small; the button around it is a full 44 px touch target.
        className="-my-2 inline-flex min-h-target min-w-target items-center justify-center rounded-full"
        data-testid="source-marker"
      >
        <span className={`inline-flex h-7 min-w-7 items-center justify-center rounded-full border px-1.5 text-xs font-semibold ${tone[provenance]}`}>
          {label.short}
          {sourceNumber ? <sup className="ml-0.5">{sourceNumber}</sup> : null}
        </span>
      </button>
      <span
        role="tooltip"
        id={tipId}
        className={`absolute bottom-full z-20 mb-2 hidden w-64 max-w-[75vw] rounded-lg max-sm:fixed max-sm:inset-x-4 max-sm:top-auto max-sm:bottom-4 max-sm:mb-0 max-sm:w-auto max-sm:max-w-none max-sm:text-sm bg-stone-900 p-2 text-xs leading-snug text-white shadow-lg group-focus-within:block group-hover:block ${align === 'end' ? 'right-0' : 'left-0'}`}
      >
        <strong className="block">{label.long}</strong>
        {citation && <span className="block">{citation}</span>}
        {note && <span className="mt-1 block text-stone-200">{note}</span>}
      </span>
    </span>
  );
}
