import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/page-guard';
import { getProfile } from '@/lib/data/users';
import { roleLabels } from '@/lib/auth/roles';
import { ProfileForm } from './_components/profile-form';

export const metadata: Metadata = { title: 'Your profile' };

export default async function ProfilePage() {
  const actor = await requirePageUser('/profile');
  const profile = await getProfile(actor);
  return (
    <div className="max-w-xl space-y-6">
      <h1 className="page-title">Your profile</h1>
      <p className="text-stone-700">
        {profile.email} · {roleLabels[profile.role]}
      </p>
      <ProfileForm initial={{ name: profile.name ?? '', digestOptIn: profile.digestOptIn, reminderOptIn: profile.reminderOptIn }} />
    </div>
  );
}
