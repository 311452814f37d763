/** The join link tasters' phones open, built from the app's public address (APP_URL). Pure. */

/** `http://192.168.1.20:3000/join?code=KX4P2M` — a trailing slash or path on APP_URL is respected. */
export function joinLink(appUrl: string, joinCode: string): string {
  const base = appUrl.endsWith('/') ? appUrl : `${appUrl}/`;
  const url = new URL('join', base);
  url.searchParams.set('code', joinCode);
  return url.toString();
}

/** True when the address only works on the machine running the app (localhost, 127.x, ::1): no phone can open it. */
export function isLoopbackUrl(appUrl: string): boolean {
  let host: string;
  try {
    host = new URL(appUrl).hostname.toLowerCase();
  } catch {
    return false;
  }
  return host === 'localhost' || host.endsWith('.localhost') || /^127\.\d+\.\d+\.\d+$/.test(host) || host === '[::1]' || host === '::1' || host === '0.0.0.0';
}
