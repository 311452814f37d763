/** Runs once when the server starts: a bad environment stops it here with a readable message. */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { env } = await import('./lib/env');
    env();
  }
}
