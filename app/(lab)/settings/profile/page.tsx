import { requirePage } from '@/lib/page-guard';
import { PageHeader } from '@/components/ui/Card';
import { PreferencesForm } from '@/components/settings/PreferencesForm';
import { SignOutEverywhere } from '@/components/settings/SignOutEverywhere';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Profile & units' };

export default async function ProfilePage() {
  const actor = await requirePage('account.self');
  return (
    <>
      <PageHeader title="Profile & units" lead={`Signed in as ${actor.email}.`} />
      <PreferencesForm name={actor.name} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} />
      <SignOutEverywhere />
    </>
  );
}
