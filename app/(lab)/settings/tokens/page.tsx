import { requirePage } from '@/lib/page-guard';
import { PageHeader } from '@/components/ui/Card';
import { TokensPanel } from '@/components/settings/TokensPanel';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'API tokens' };

export default async function TokensPage() {
  await requirePage('tokens.manage');
  return (
    <>
      <PageHeader title="API tokens" lead="Personal tokens let your scripts use the JSON API as you. The description of every endpoint is at /api/v1/openapi.json." />
      <TokensPanel />
    </>
  );
}
