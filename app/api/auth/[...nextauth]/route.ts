import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth';

export const dynamic = 'force-dynamic';

async function handler(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(authOptions())(req, { params: await ctx.params });
}

export { handler as GET, handler as POST };
