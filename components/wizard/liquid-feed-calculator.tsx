'use client';
import { useId, useState } from 'react';
import { liquidFeedPpm } from '@/lib/wizard/feeding';

/** ppm of N, P and K for a liquid feed, from grams per litre and the label's N-P₂O₅-K₂O. */
export function LiquidFeedCalculator() {
  const id = useId();
  const [v, setV] = useState({ g: '1', n: '20', p: '20', k: '20' });
  const num = (s: string) => (s.trim() === '' ? NaN : Number(s));
  const vals = { g: num(v.g), n: num(v.n), p: num(v.p), k: num(v.k) };
  const ok = Object.values(vals).every((x) => Number.isFinite(x) && x >= 0) && vals.n <= 100 && vals.p <= 100 && vals.k <= 100;
  const ppm = ok ? liquidFeedPpm(vals.g, { n: vals.n, p2o5: vals.p, k2o: vals.k }) : null;
  const field = (key: keyof typeof v, label: string) => (
    <div>
      <label htmlFor={`${id}-${key}`} className="field-label">
        {label}
      </label>
      <input
        id={`${id}-${key}`}
        type="number"
        inputMode="decimal"
        min={0}
        step="0.1"
        className="field-input"
        value={v[key]}
        onChange={(e) => setV({ ...v, [key]: e.target.value })}
      />
    </div>
  );
  return (
    <section className="card" aria-labelledby={`${id}-h`} data-testid="liquid-calculator">
      <h3 id={`${id}-h`} className="text-lg">
        Liquid feed strength
      </h3>
      <p className="text-stone-700">From the label analysis (N-P₂O₅-K₂O, in %) and how much you dissolve per litre.</p>
      <div className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
        {field('g', 'Grams per litre')}
        {field('n', 'N %')}
        {field('p', 'P₂O₅ %')}
        {field('k', 'K₂O %')}
      </div>
      <p className="mt-3 text-lg" aria-live="polite" data-testid="ppm">
        {ppm ? (
          <>
            N {ppm.n.toFixed(0)} ppm · P {ppm.p.toFixed(1)} ppm · K {ppm.k.toFixed(1)} ppm
          </>
        ) : (
          'Enter numbers from 0 (percentages up to 100).'
        )}
      </p>
      <p className="text-sm text-stone-700">ppm = g/L × % × 10; P = P₂O₅ × 0.436, K = K₂O × 0.830 (the oxide-to-element factors labels use).</p>
    </section>
  );
}
