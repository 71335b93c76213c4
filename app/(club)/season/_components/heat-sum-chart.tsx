'use client';

import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

const COLOURS = ['#2f5d3a', '#8a6d3b', '#4b6f8f', '#7a4f7a', '#6b6b6b'];

/** This season's heat sum against earlier years, by day of the season year. */
export function HeatSumChart({
  years,
  hemisphere,
}: {
  years: { year: number; total: number; points: { day: number; gdd: number }[] }[];
  hemisphere: 'north' | 'south';
}) {
  const shown = years.slice(-5);
  const byDay = new Map<number, Record<string, number>>();
  for (const y of shown) for (const p of y.points) (byDay.get(p.day) ?? byDay.set(p.day, { day: p.day }).get(p.day)!)[String(y.year)] = p.gdd;
  const data = [...byDay.values()].sort((a, b) => a.day - b.day);
  const startWord = hemisphere === 'north' ? '1 January' : '1 July';
  return (
    <figure className="space-y-2" data-testid="heat-sum-chart">
      <div className="h-64 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
            <CartesianGrid strokeDasharray="3 3" />
            <XAxis dataKey="day" type="number" domain={[0, 365]} tickCount={7} />
            <YAxis width={48} />
            <Tooltip />
            <Legend />
            {shown.map((y, i) => (
              <Line
                key={y.year}
                dataKey={String(y.year)}
                name={String(y.year)}
                dot={false}
                connectNulls
                isAnimationActive={false}
                stroke={COLOURS[(shown.length - 1 - i) % COLOURS.length]}
                strokeWidth={i === shown.length - 1 ? 3 : 1.5}
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-sm text-stone-700">
        {`Heat sum (°C days above +5 °C) by day since ${startWord}. `}
        {shown.map((y) => `${y.year}: ${y.total}`).join('; ')}
      </figcaption>
    </figure>
  );
}
