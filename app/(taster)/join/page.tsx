import { JoinForm } from '@/components/taster/JoinForm';
import { normalizeJoinCode } from '@/lib/taster';

export const metadata = { title: 'Join a tasting' };

export default async function JoinPage({ searchParams }: { searchParams: Promise<{ code?: string | string[] }> }) {
  const q = await searchParams;
  const code = normalizeJoinCode(Array.isArray(q.code) ? (q.code[0] ?? '') : (q.code ?? ''));
  return (
    <>
      <h1 className="mb-1 font-display text-3xl text-damson-900">Join a tasting</h1>
      <p className="mb-6 text-base text-rind-600">Enter the code from the tasting and the name you want to use.</p>
      <JoinForm initialCode={code} />
    </>
  );
}
