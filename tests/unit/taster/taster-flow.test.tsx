// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';
import { HEDONIC_9_LABELS, ratedSeatPayload, SEAT_TOKEN } from './fixtures';

vi.mock('next/navigation', () => ({
  useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }),
  usePathname: () => '/',
  useSearchParams: () => new URLSearchParams(),
}));

import { renderToString } from 'react-dom/server';
import { TastingFlow } from '@/components/taster/TastingFlow';
import { parseSeatView, queueStorageKey, RINSE_REMINDER } from '@/lib/taster';

type Call = { method: string; url: string; body: any };

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

/** A stand-in panel API: answers GET with `seat`, and records every other call. */
function mockApi(seat: unknown, overrides: { put?: (body: any) => Response | Promise<Response>; submit?: () => Response } = {}) {
  const calls: Call[] = [];
  const base = `/api/v1/tastings/seats/${SEAT_TOKEN}`;
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    const method = init?.method ?? 'GET';
    const body = init?.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ method, url, body });
    if (method === 'GET' && url === base) return json(200, seat);
    if (method === 'POST' && url === `${base}/consent`) return json(200, {});
    if (method === 'PUT' && url === `${base}/answers`) return overrides.put ? overrides.put(body) : json(200, { stored: true, duplicate: false });
    if (method === 'POST' && url === `${base}/submit`) return overrides.submit ? overrides.submit() : json(200, {});
    return json(404, { error: { code: 'not_found', message: 'Nothing here' } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, puts: () => calls.filter((c) => c.method === 'PUT').map((c) => c.body) };
}

function expectNoSecrets() {
  expect(document.body.innerHTML).not.toContain('SECRET');
  for (let i = 0; i < window.localStorage.length; i++) {
    const key = window.localStorage.key(i)!;
    expect(key).not.toContain('SECRET');
    expect(window.localStorage.getItem(key) ?? '').not.toContain('SECRET');
  }
}

async function rate(label: string) {
  fireEvent.click(screen.getByLabelText(label));
}

beforeEach(() => {
  window.localStorage.clear();
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.clearAllMocks();
});

describe('TastingFlow', () => {
  it('walks notice → consent → samples with rinse screens → review → submit → thank you', async () => {
    const api = mockApi(ratedSeatPayload());
    render(<TastingFlow seatToken={SEAT_TOKEN} />);

    // The organiser's notice is shown verbatim as text, never as HTML.
    await screen.findByRole('heading', { name: 'Autumn damson round' });
    expect(screen.getByText(/Contains sulphites and traces of almond\./).textContent).toContain('<b>product development</b>');
    expect(document.querySelector('b')).toBeNull();
    expectNoSecrets();

    fireEvent.click(screen.getByRole('button', { name: 'I agree, start' }));
    await screen.findByText('Sample 1 of 3');
    expect(api.calls.some((c) => c.method === 'POST' && c.url.endsWith('/consent'))).toBe(true);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toContain('482');

    // Source: Peryam & Pilgrim (1957) — all nine hedonic anchors are offered, 9 down to 1.
    const options = screen.getAllByRole('radio').map((r) => r.closest('label')?.textContent);
    expect(options).toEqual(HEDONIC_9_LABELS);

    const next = screen.getByRole('button', { name: 'Next' });
    expect(next).toHaveProperty('disabled', true);
    await rate('Like moderately');
    await waitFor(() => expect(api.puts()).toHaveLength(1));
    const put = api.puts()[0];
    expect(put).toMatchObject({ code: '482', attributeId: 'attr-liking', value: 7 });
    expect(put.idempotencyKey).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    await screen.findByText('Sent');
    expectNoSecrets();

    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    expect(screen.getByText(RINSE_REMINDER)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Next sample' }));
    expect(screen.getByText('Sample 2 of 3')).toBeTruthy();
    await rate('Dislike slightly');
    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    fireEvent.click(screen.getByRole('button', { name: 'Next sample' }));
    expect(screen.getByText('Sample 3 of 3')).toBeTruthy();
    await rate('Like extremely');
    fireEvent.click(screen.getByRole('button', { name: 'Review my answers' }));

    await screen.findByRole('heading', { name: 'Check your answers' });
    expect(screen.getByText('Sample 615').closest('li')?.textContent).toContain('Dislike slightly');
    // Change goes back to the sample and returns to the review.
    fireEvent.click(screen.getByRole('button', { name: 'Change sample 615' }));
    expect(screen.getByText('Sample 2 of 3')).toBeTruthy();
    await rate('Neither like nor dislike');
    fireEvent.click(screen.getByRole('button', { name: 'Back to review' }));
    expect(screen.getByText('Sample 615').closest('li')?.textContent).toContain('Neither like nor dislike');

    await waitFor(() => expect(screen.getByRole('button', { name: 'Submit my answers' })).toHaveProperty('disabled', false));
    expect(api.puts().map((b) => [b.code, b.value])).toEqual([
      ['482', 7],
      ['615', 4],
      ['903', 9],
      ['615', 5],
    ]);
    fireEvent.click(screen.getByRole('button', { name: 'Submit my answers' }));
    await screen.findByRole('heading', { name: 'Thank you!' });
    expect(api.calls.some((c) => c.method === 'POST' && c.url.endsWith('/submit'))).toBe(true);
    expect(window.localStorage.getItem(queueStorageKey(SEAT_TOKEN))).toBeNull();
    expectNoSecrets();
  });

  it('resumes after a reload at the first sample with no answer, from server answers and the stored queue', async () => {
    // Sample 482 is on the server; 615 is still in this phone's queue from before the reload.
    window.localStorage.setItem(
      queueStorageKey(SEAT_TOKEN),
      JSON.stringify({
        v: 1,
        items: [{ idempotencyKey: '3f1c2a9e-8b7d-4c6e-9a5b-1d2e3f4a5b6c', attempts: 2, answer: { kind: 'rated', code: '615', attributeId: 'attr-liking', value: 3 } }],
      }),
    );
    const api = mockApi(ratedSeatPayload({ consented: true, answers: [{ code: '482', attributeId: 'attr-liking', value: 8, variantName: 'SECRET' }] }));
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    await screen.findByText('Sample 3 of 3');
    expect(screen.getByRole('heading', { level: 1 }).textContent).toContain('903');
    // The queued answer goes out with the key it was given before the reload.
    await waitFor(() => expect(api.puts()).toEqual([{ idempotencyKey: '3f1c2a9e-8b7d-4c6e-9a5b-1d2e3f4a5b6c', code: '615', attributeId: 'attr-liking', value: 3 }]));
    await waitFor(() => expect(window.localStorage.getItem(queueStorageKey(SEAT_TOKEN))).toBeNull());
    expectNoSecrets();
  });

  it('keeps answers on the phone while offline and says how many wait', async () => {
    mockApi(ratedSeatPayload({ consented: true }), {
      put: () => {
        throw new TypeError('Failed to fetch');
      },
    });
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    await screen.findByText('Sample 1 of 3');
    await rate('Like slightly');
    await screen.findByText('Saved on this phone — offline, 1 answer to send');
    const stored = JSON.parse(window.localStorage.getItem(queueStorageKey(SEAT_TOKEN))!);
    expect(stored.items).toHaveLength(1);
    expect(stored.items[0].answer).toEqual({ kind: 'rated', code: '482', attributeId: 'attr-liking', value: 6 });
    expectNoSecrets();
  });

  it('stops and shows what was saved when the session closes mid-way', async () => {
    let first = true;
    mockApi(ratedSeatPayload({ consented: true }), {
      put: () => {
        if (first) {
          first = false;
          return json(200, { stored: true, duplicate: false });
        }
        return json(409, { error: { code: 'closed', message: 'The organiser closed this tasting at 11:30.' } });
      },
    });
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    await screen.findByText('Sample 1 of 3');
    await rate('Like very much');
    await screen.findByText('Sent');
    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    fireEvent.click(screen.getByRole('button', { name: 'Next sample' }));
    await rate('Dislike moderately');
    await screen.findByRole('heading', { name: 'This tasting has closed' });
    expect(screen.getByText('The organiser closed this tasting at 11:30.')).toBeTruthy();
    const saved = screen.getByText('Sample 482').closest('li')!.textContent!;
    const unsaved = screen.getByText('Sample 615').closest('li')!.textContent!;
    expect(saved).toContain('Like very much');
    expect(saved).toContain('Sent');
    expect(unsaved).toContain('Dislike moderately');
    expect(unsaved).toContain('Not sent');
  });

  it('shows the closed screen straight away for a session that has already closed', async () => {
    const api = mockApi(ratedSeatPayload({ consented: true, state: 'closed', answers: [{ code: '482', attributeId: 'attr-liking', value: 2 }] }));
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    await screen.findByRole('heading', { name: 'This tasting has closed' });
    expect(screen.getByText('Sample 482').closest('li')?.textContent).toContain('Dislike very much');
    expect(api.puts()).toHaveLength(0);
  });

  it('debounces a line scale, moves it with the arrow keys and sends one answer', async () => {
    const api = mockApi(
      ratedSeatPayload({
        consented: true,
        attributes: [{ id: 'attr-fruit', name: 'Fruit flavour', instruction: '', scale: { kind: 'line', min: 0, max: 10, step: 0.5, lowAnchor: 'None', highAnchor: 'Very strong' } }],
      }),
    );
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    const slider = await screen.findByLabelText('Fruit flavour');
    expect(screen.getByText('None')).toBeTruthy();
    expect(screen.getByText('Very strong')).toBeTruthy();
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    fireEvent.keyDown(slider, { key: 'ArrowRight' });
    expect(document.querySelector('output')?.textContent).toBe('6');
    expect(api.puts()).toHaveLength(0);
    await waitFor(() => expect(api.puts()).toHaveLength(1), { timeout: 2000 });
    expect(api.puts()[0]).toMatchObject({ code: '482', attributeId: 'attr-fruit', value: 6 });
  });

  it('says so when the seat link is unknown', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json(404, { error: { code: 'not_found', message: 'Unknown seat' } })));
    render(<TastingFlow seatToken="seat_unknown_123" />);
    await screen.findByText(/This tasting link is not valid/);
  });
});

describe('TastingFlow, other methods', () => {
  it('ranks with up and down buttons and saves the order, best first', async () => {
    const payload = { ...ratedSeatPayload({ consented: true }), ranking: { attributeId: 'attr-liking', instruction: 'Put your favourite at the top.' } };
    payload.session.method = 'ranking';
    const api = mockApi(payload);
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    await screen.findByText('Put your favourite at the top.');
    fireEvent.click(screen.getByRole('button', { name: 'Move 903 up' }));
    fireEvent.click(screen.getByRole('button', { name: 'Move 903 up' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save this order' }));
    await waitFor(() => expect(api.puts()).toHaveLength(1));
    expect(api.puts()[0]).toMatchObject({ attributeId: 'attr-liking', ranking: ['903', '482', '615'] });
    await screen.findByRole('heading', { name: 'Check your answers' });
    expectNoSecrets();
  });

  it('asks for the odd sample of a triangle and sends the confidence with it', async () => {
    const payload = ratedSeatPayload({ consented: true, attributes: [] });
    payload.session.method = 'triangle';
    const api = mockApi(payload);
    render(<TastingFlow seatToken={SEAT_TOKEN} />);
    // Source: ISO 4120 (triangle test) — the three samples in serving order; the assessor names the odd one.
    await screen.findByText('Which sample is the odd one?');
    expect(screen.getAllByRole('radio', { name: /^\d{3}$/ }).map((r) => (r as HTMLInputElement).value)).toEqual(['482', '615', '903']);
    fireEvent.click(screen.getByRole('radio', { name: '615' }));
    fireEvent.click(screen.getByRole('radio', { name: 'Fairly sure' }));
    await waitFor(() => expect(api.puts()).toHaveLength(2));
    expect(api.puts()[1]).toMatchObject({ oddCode: '615', confidence: 2 });
    expect(api.puts()[1].idempotencyKey).not.toBe(api.puts()[0].idempotencyKey);
    fireEvent.click(screen.getByRole('button', { name: 'Review my answers' }));
    await screen.findByRole('heading', { name: 'Check your answers' });
    expect(screen.getByText('Fairly sure')).toBeTruthy();
  });
});

describe('TastingFlow, first screen read by the page', () => {
  it('has the sample code, the question and the answers in the server HTML, disabled until the script runs', () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    const view = parseSeatView(ratedSeatPayload({ consented: true }));
    const html = renderToString(<TastingFlow seatToken={SEAT_TOKEN} first={view} />);
    expect(html).toContain('Sample <!-- -->1<!-- --> of <!-- -->3');
    expect(html).toContain('482');
    expect(html).toContain('Overall liking');
    expect(html).toContain('Like moderately');
    expect(html).toMatch(/<fieldset[^>]* disabled=""/);
    expect(html).toContain('Getting the page ready…');
    expect(html).not.toContain('Loading your tasting');
    expect(html).not.toContain('SECRET');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('starts on the page’s view without asking the API, merges answers still on the phone and sends them', async () => {
    window.localStorage.setItem(
      queueStorageKey(SEAT_TOKEN),
      JSON.stringify({ v: 1, items: [{ idempotencyKey: '3f1c2a9e-8b7d-4c6e-9a5b-1d2e3f4a5b6c', attempts: 1, answer: { kind: 'rated', code: '482', attributeId: 'attr-liking', value: 3 } }] }),
    );
    const api = mockApi(ratedSeatPayload({ consented: true }));
    render(<TastingFlow seatToken={SEAT_TOKEN} first={parseSeatView(ratedSeatPayload({ consented: true }))} />);
    // The phone's waiting answer to 482 moves the taster on to the next sample.
    await screen.findByText('Sample 2 of 3');
    await waitFor(() => expect(api.puts()).toEqual([{ idempotencyKey: '3f1c2a9e-8b7d-4c6e-9a5b-1d2e3f4a5b6c', code: '482', attributeId: 'attr-liking', value: 3 }]));
    expect(api.calls.filter((c) => c.method === 'GET')).toHaveLength(0);
    await rate('Like slightly');
    await screen.findByText('Sent');
    expect(api.puts().map((b) => [b.code, b.value])).toEqual([
      ['482', 3],
      ['615', 6],
    ]);
  });
});
