import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageRole } from '@/lib/auth/page-guard';
import { listUsers } from '@/lib/data/users';
import { getClubSettings } from '@/lib/data/settings';
import { UsersTable } from './_components/users-table';
import { SettingsForm } from './_components/settings-form';
import { ReminderRuns } from './_components/reminder-runs';
import { listReminderRuns, mondayOf } from '@/lib/data/reminders';
import { todayIso } from '@/lib/validation/trees';

export const metadata: Metadata = { title: 'Admin' };

export default async function AdminPage() {
  const actor = await requirePageRole('admin', '/admin');
  const [users, settings, runs] = await Promise.all([listUsers(actor), getClubSettings(), listReminderRuns(actor)]);
  return (
    <div className="space-y-10">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h1 className="page-title">Club administration</h1>
        <Link href="/admin/outbox" className="btn-secondary">
          Outbox
        </Link>
      </div>
      <section aria-labelledby="settings-heading" className="space-y-3">
        <h2 id="settings-heading" className="text-xl">
          Club settings
        </h2>
        <p className="text-stone-700">The wizard uses the hemisphere and latitude when a member does not give their own.</p>
        <SettingsForm initial={settings} />
      </section>
      <section aria-labelledby="reminders-heading" className="space-y-3">
        <h2 id="reminders-heading" className="text-xl">
          Weekly reminders
        </h2>
        <p className="text-stone-700">
          Each member who turned reminders on gets one e-mail listing the week’s tasks on their trees; members with nothing due get none, and nobody gets the
          same week twice.
        </p>
        <ReminderRuns initial={runs} thisMonday={mondayOf(todayIso())} />
      </section>
      <section aria-labelledby="users-heading" className="space-y-3">
        <h2 id="users-heading" className="text-xl">
          Members and roles
        </h2>
        <UsersTable initial={users} currentUserId={actor.id} />
      </section>
    </div>
  );
}
