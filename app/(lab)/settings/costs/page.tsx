import { requirePage } from '@/lib/page-guard';
import { PageHeader, Card } from '@/components/ui/Card';
import { CostSettingsForm } from '@/components/pricing/CostSettingsForm';
import { costSettings, workspaceHasPrices } from '@/lib/pricing/queries';
import { currencyChoices } from '@/lib/pricing/money';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Costs and currency' };

export default async function CostSettingsPage() {
  const actor = await requirePage('costs.settings');
  const settings = await costSettings(actor.workspaceId);
  const locked = settings.currency !== null && (await workspaceHasPrices(actor.workspaceId));
  return (
    <>
      <PageHeader title="Costs and currency" lead="The one currency every price in this workspace is stated in, and the settings costs are worked out with." />
      <Card>
        <CostSettingsForm settings={settings} currencies={currencyChoices()} currencyLocked={locked} />
      </Card>
    </>
  );
}
