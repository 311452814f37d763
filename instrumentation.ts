/** Runs once when the server starts: a bad environment stops it here with a readable message. */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { env } = await import('./lib/env');
    env();
    // The socket's address for the per-address limits (lib/client-address.ts).
    const { installPeerAddressHook } = await import('./lib/client-address');
    installPeerAddressHook();
  }
}
