'use client';

import { signOut } from 'next-auth/react';
import { Button } from '@/components/ui/Button';

export function SignOutButton({ tone = 'primary' }: { tone?: 'primary' | 'ghost' }) {
  return (
    <Button tone={tone} type="button" onClick={() => signOut({ callbackUrl: '/sign-in' })}>
      Sign out
    </Button>
  );
}
