import { describe, expect, it } from 'vitest';
import { isLoopbackUrl, joinLink } from '@/lib/tastings/join-link';

describe('the join link', () => {
  it('is built from the public APP_URL', () => {
    expect(joinLink('http://192.168.1.20:3000', 'KX4P2M')).toBe('http://192.168.1.20:3000/join?code=KX4P2M');
    expect(joinLink('https://lab.example.org/setwell/', 'KX4P2M')).toBe('https://lab.example.org/setwell/join?code=KX4P2M');
  });

  it('knows an address that only the machine itself can open', () => {
    for (const url of ['http://localhost:3000', 'http://127.0.0.1:3100', 'http://[::1]:3000', 'http://app.localhost', 'http://0.0.0.0:3000']) expect(isLoopbackUrl(url), url).toBe(true);
    for (const url of ['http://192.168.1.20:3000', 'https://lab.example.org', 'http://kitchen-pc.local:3000']) expect(isLoopbackUrl(url), url).toBe(false);
  });
});
