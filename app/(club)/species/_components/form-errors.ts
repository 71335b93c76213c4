import type { FieldErrors, FieldValues } from 'react-hook-form';

/** The message at a dotted path of react-hook-form errors, if any. */
export function errorAt<T extends FieldValues>(errors: FieldErrors<T>, path: string): string | undefined {
  let cur: unknown = errors;
  for (const part of path.split('.')) {
    if (cur == null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string, unknown>)[part];
  }
  const m = (cur as { message?: unknown } | undefined)?.message;
  return typeof m === 'string' ? m : undefined;
}
