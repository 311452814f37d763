import { redirect } from 'next/navigation';
import { currentActor } from '@/lib/auth';

export const dynamic = 'force-dynamic';

export default async function Root() {
  redirect((await currentActor()) ? '/home' : '/sign-in');
}
