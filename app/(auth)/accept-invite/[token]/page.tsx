import Link from 'next/link';
import { previewInvitation } from '@/lib/account/queries';
import { AcceptInvitationForm } from '@/components/auth/AccountForms';
import { Notice } from '@/components/ui/Notice';
import { ROLE_LABELS, type Role } from '@/lib/permissions';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Accept invitation' };

export default async function AcceptInvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await previewInvitation(token);
  if (!invitation) {
    return (
      <>
        <h1 className="mb-4 text-2xl font-semibold">This invitation cannot be used</h1>
        <Notice tone="warning">It has expired, was revoked, or was already accepted. Ask the person who invited you to send a new one.</Notice>
        <p className="mt-4 text-sm">
          <Link href="/sign-in" className="text-damson-700 underline underline-offset-2">
            Go to sign in
          </Link>
        </p>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-2xl font-semibold">Join {invitation.workspaceName}</h1>
      <p className="mb-6 text-sm text-rind-600">
        You were invited as <strong>{ROLE_LABELS[invitation.role as Role]}</strong> with the address <strong>{invitation.email}</strong>.
      </p>
      <AcceptInvitationForm token={token} hasAccount={invitation.hasAccount} />
    </>
  );
}
