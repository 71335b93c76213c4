import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/page-guard';
import { hasRole } from '@/lib/auth/roles';
import { getClubSettings } from '@/lib/data/settings';
import { listRecords } from '@/lib/data/season';
import { RecordImport } from './_components/record-import';
import { HeatSumChart } from './_components/heat-sum-chart';

export const metadata: Metadata = { title: 'Temperature record' };

export default async function SeasonPage() {
  const actor = await requirePageUser('/season');
  const settings = await getClubSettings();
  const records = await listRecords(actor, settings.hemisphere);
  const canClub = hasRole(actor.role, 'librarian');
  return (
    <div className="space-y-8">
      <h1 className="page-title">Temperature record</h1>
      <p className="max-w-2xl text-stone-700">
        Daily lowest and highest temperatures give the heat sum (°C days above +5 °C) that times every tree’s season. The club keeps one record; you may keep
        your own for your garden, which then times your trees.
      </p>
      {records.length === 0 ? (
        <p className="card" data-testid="no-record">
          No temperature record yet: trees are timed from the club’s latitude.
        </p>
      ) : null}
      {records.map((r) => (
        <section key={r.scope} aria-labelledby={`rec-${r.scope}`} className="card space-y-3" data-testid={`record-${r.scope}`}>
          <h2 id={`rec-${r.scope}`} className="text-xl">
            {r.scope === 'club' ? 'Club record' : 'Your record'}
          </h2>
          <p className="text-sm text-stone-700">{`${r.dayCount} days, ${r.firstDay} to ${r.lastDay}.`}</p>
          <HeatSumChart years={r.years} hemisphere={settings.hemisphere} />
        </section>
      ))}
      <RecordImport canClub={canClub} />
    </div>
  );
}
