/**
 * Who is asking, and which host they addressed: the client address keys the per-address rate
 * limits, the host is what the Origin check compares with. Forwarding headers are believed only
 * when TRUST_PROXY=true (a proxy of ours sets them); otherwise a client could write them.
 *
 * Next.js does not hand route handlers or server actions the socket, and it fills in
 * X-Forwarded-For from the socket only when the client sent none. So at server start
 * (instrumentation.ts) we record the socket's address in a header of our own, overwriting
 * whatever a client put there.
 */
import http from 'node:http';
import { env } from '@/lib/env';

export const PEER_ADDRESS_HEADER = 'x-setwell-peer-address';
/** The one bucket for requests whose address is unknown (handlers called outside a server, as in tests). */
export const UNKNOWN_ADDRESS = 'unknown';

/** Typed in lib/process-cache.ts. */
const state = globalThis;

/** Records every incoming request's socket address in PEER_ADDRESS_HEADER. Idempotent. */
export function installPeerAddressHook(): void {
  if (state.setwellPeerHook) return;
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === 'request') {
      const req = args[0] as http.IncomingMessage;
      req.headers[PEER_ADDRESS_HEADER] = req.socket?.remoteAddress ?? UNKNOWN_ADDRESS;
    }
    return (emit as (this: http.Server, event: string | symbol, ...args: unknown[]) => boolean).call(this, event, ...args);
  } as typeof emit;
  state.setwellPeerHook = true;
}

type HeaderSource = Headers | Record<string, unknown>;

function header(headers: HeaderSource, name: string): string | undefined {
  const value = headers instanceof Headers ? headers.get(name) : headers[name];
  if (Array.isArray(value)) return value.join(',');
  return typeof value === 'string' ? value : undefined;
}

export function trustsProxy(): boolean {
  return env().TRUST_PROXY === 'true';
}

/**
 * The client's address. Behind a trusted proxy: the right-most X-Forwarded-For entry, the one
 * our proxy appended (entries to its left are the client's own claims). Otherwise: the socket's.
 */
export function clientAddress(headers: HeaderSource): string {
  if (trustsProxy()) {
    const forwarded = header(headers, 'x-forwarded-for')?.split(',').map((s) => s.trim()).filter(Boolean);
    const address = forwarded?.at(-1) ?? header(headers, 'x-real-ip')?.trim();
    if (address) return address;
  }
  // Only our hook writes this header; without it (no server in this process) the header may be the client's.
  const peer = state.setwellPeerHook ? header(headers, PEER_ADDRESS_HEADER)?.trim() : undefined;
  return peer || UNKNOWN_ADDRESS;
}

/** The host the request was addressed to: X-Forwarded-Host only behind a trusted proxy, else Host. */
export function requestHost(headers: Headers): string | null {
  const forwarded = trustsProxy() ? headers.get('x-forwarded-host')?.split(',')[0].trim() : undefined;
  return forwarded || headers.get('host');
}
