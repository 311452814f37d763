import { requirePage } from '@/lib/page-guard';
import { PageHeader } from '@/components/ui/Card';
import { MembersTable } from '@/components/members/MembersTable';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Members' };

export default async function MembersPage() {
  const actor = await requirePage('members.manage');
  return (
    <>
      <PageHeader title="Members" lead="Invite people by e-mail and give each person a role. A workspace always keeps at least one active administrator." />
      <MembersTable currentUserId={actor.userId} />
    </>
  );
}
