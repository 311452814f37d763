// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { uploadPhoto } from '@/components/notebook/uploadImage';

/** A stand-in for the browser's XMLHttpRequest that records the request and answers as told. */
class ScriptedRequest {
  static last: ScriptedRequest | null = null;
  static answer: { status: number; body: string } | 'network-error' = { status: 201, body: '{}' };
  method = '';
  url = '';
  sent: FormData | null = null;
  status = 0;
  responseText = '';
  responseType = '';
  upload: { onprogress: ((e: { lengthComputable: boolean; loaded: number; total: number }) => void) | null } = { onprogress: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  send(body: FormData) {
    ScriptedRequest.last = this;
    this.sent = body;
    this.upload.onprogress?.({ lengthComputable: true, loaded: 50, total: 200 });
    const answer = ScriptedRequest.answer;
    queueMicrotask(() => {
      if (answer === 'network-error') return this.onerror?.();
      this.status = answer.status;
      this.responseText = answer.body;
      this.onload?.();
    });
  }
}

afterEach(() => vi.unstubAllGlobals());

const TRIAL_ID = '6b1f4c9e-2d3a-4e5f-8a7b-9c0d1e2f3a4b';
const VARIANT_ID = '7c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f';
const photo = () => new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47])], 'set-test.png', { type: 'image/png' });

describe('uploadPhoto (POST /api/v1/trials/{trialId}/uploads)', () => {
  it('sends file and variantId as multipart and returns the upload', async () => {
    vi.stubGlobal('XMLHttpRequest', ScriptedRequest);
    const upload = { id: 'u1', url: '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d', thumbnailUrl: null, width: 4, height: 4, originalName: 'set-test.png', kind: 'photo' };
    ScriptedRequest.answer = { status: 201, body: JSON.stringify({ upload }) };
    const progress: number[] = [];
    const outcome = await uploadPhoto(TRIAL_ID, VARIANT_ID, photo(), (f) => progress.push(f));
    expect(outcome).toEqual({ ok: true, upload });
    const req = ScriptedRequest.last!;
    expect(req.method).toBe('POST');
    expect(req.url).toBe(`/api/v1/trials/${TRIAL_ID}/uploads`);
    expect((req.sent!.get('file') as File).name).toBe('set-test.png');
    expect(req.sent!.get('variantId')).toBe(VARIANT_ID);
    // No subject: the upload API accepts only the photo subjects it knows (jar, set test, spread, other).
    expect(req.sent!.get('subject')).toBeNull();
    expect(progress).toEqual([0.25]);
  });

  it("passes on the API's own message for 413 and 415, and leaves variantId out for the trial's entry", async () => {
    vi.stubGlobal('XMLHttpRequest', ScriptedRequest);
    // Source: RFC 9110 §15.5.14 (413 Content Too Large) and §15.5.16 (415 Unsupported Media Type).
    ScriptedRequest.answer = { status: 413, body: JSON.stringify({ error: { code: 'too_large', message: 'Photos may be at most 12 MB.' } }) };
    expect(await uploadPhoto(TRIAL_ID, null, photo(), () => undefined)).toEqual({ ok: false, message: 'Photos may be at most 12 MB.' });
    expect(ScriptedRequest.last!.sent!.has('variantId')).toBe(false);
    ScriptedRequest.answer = { status: 415, body: 'not json' };
    expect(await uploadPhoto(TRIAL_ID, null, photo(), () => undefined)).toEqual({ ok: false, message: 'That file type cannot be used as a photo.' });
  });

  it('reports a network failure', async () => {
    vi.stubGlobal('XMLHttpRequest', ScriptedRequest);
    ScriptedRequest.answer = 'network-error';
    const outcome = await uploadPhoto(TRIAL_ID, null, photo(), () => undefined);
    expect(outcome).toMatchObject({ ok: false });
    expect(outcome.ok ? '' : outcome.message).toMatch(/did not reach the server/);
  });
});
