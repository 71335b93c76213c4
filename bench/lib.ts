// Shared shapes of the benchmark: every measurement is a row with its target (if any) and
// whether it met it; a measurement that could not be taken says why instead of failing the run.

export interface Row {
  section: string;
  name: string;
  value: number | null;
  unit: string;
  target?: string;
  /** true met, false missed, null no target or not measured */
  pass: boolean | null;
  note?: string;
}

export const rows: Row[] = [];
export const extra: Record<string, unknown> = {};

export function record(r: Row) {
  rows.push(r);
  return r;
}

export function notAvailable(section: string, name: string, why: string, target?: string) {
  return record({ section, name, value: null, unit: '', target, pass: null, note: `not available: ${why}` });
}

export const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;

export function percentile(values: number[], p: number) {
  if (!values.length) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const i = Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1));
  return s[i];
}

export const median = (v: number[]) => percentile(v, 50);

export function printTable() {
  const fmt = (r: Row) => (r.value === null ? '—' : `${round(r.value, r.value >= 100 ? 0 : 2)} ${r.unit}`.trim());
  const mark = (r: Row) => (r.pass === true ? 'met' : r.pass === false ? 'MISSED' : '');
  const table = rows.map((r) => [r.section, r.name, fmt(r), r.target ?? '', mark(r), r.note ?? '']);
  const head = ['section', 'measure', 'value', 'target', '', 'note'];
  const widths = head.map((h, i) => Math.min(60, Math.max(h.length, ...table.map((t) => t[i].length))));
  const line = (cells: string[]) =>
    cells
      .map((c, i) => c.padEnd(widths[i]))
      .join('  ')
      .trimEnd();
  console.log('');
  console.log(line(head));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const t of table) console.log(line(t));
  console.log('');
}

export const log = (...a: unknown[]) => console.error('[bench]', ...a);
