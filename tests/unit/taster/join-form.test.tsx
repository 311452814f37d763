// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
vi.mock('next/navigation', () => ({
  useRouter: () => router,
  usePathname: () => '/',
  useSearchParams: () => new URLSearchParams(),
}));

import { JoinForm } from '@/components/taster/JoinForm';
import { JOINED_SEATS_STORAGE_KEY, LAST_SEAT_STORAGE_KEY } from '@/lib/taster';
import { ratedSeatPayload } from './fixtures';

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

function fill(code: string, name: string) {
  fireEvent.change(screen.getByLabelText('Tasting code'), { target: { value: code } });
  fireEvent.change(screen.getByLabelText('Your name'), { target: { value: name } });
}

beforeEach(() => window.localStorage.clear());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.clearAllMocks();
});

describe('JoinForm', () => {
  it('joins with a case-insensitive code, remembers the seat and opens the flow', async () => {
    const fetchMock = vi.fn(async () => json(201, { seatToken: 'seat_tok_7Qx2mPz9' }));
    vi.stubGlobal('fetch', fetchMock);
    render(<JoinForm />);
    fill('qx7-k29', '  Wren ');
    expect((screen.getByLabelText('Tasting code') as HTMLInputElement).value).toBe('QX7K29');
    expect(screen.getByLabelText('Tasting code').getAttribute('autocapitalize')).toBe('characters');
    fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
    await waitFor(() => expect(router.push).toHaveBeenCalledWith('/t/seat_tok_7Qx2mPz9'));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/v1/tastings/join');
    expect(JSON.parse(String(init.body))).toEqual({ joinCode: 'QX7K29', displayName: 'Wren' });
    expect(window.localStorage.getItem(LAST_SEAT_STORAGE_KEY)).toBe('seat_tok_7Qx2mPz9');
  });

  it('takes the code from a QR link', () => {
    render(<JoinForm initialCode="ab12cd" />);
    expect((screen.getByLabelText('Tasting code') as HTMLInputElement).value).toBe('AB12CD');
  });

  it('says clearly when the code is wrong, and shows the server’s message on too many tries', async () => {
    const fetchMock = vi
      .fn()
      .mockResolvedValueOnce(json(404, { error: { code: 'not_found', message: 'No such session' } }))
      .mockResolvedValueOnce(json(429, { error: { code: 'rate_limited', message: 'Too many tries. Wait 60 seconds.' } }));
    vi.stubGlobal('fetch', fetchMock);
    render(<JoinForm />);
    fill('ZZZ999', 'Wren');
    fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
    await screen.findByText(/That code does not match an open tasting/);
    fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
    await screen.findByText('Too many tries. Wait 60 seconds.');
    expect(router.push).not.toHaveBeenCalled();
  });

  it('checks the input before calling the server', () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    render(<JoinForm />);
    fill('QX7', '');
    fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
    expect(screen.getByText('The code has 6 letters or digits.')).toBeTruthy();
    expect(screen.getByText('Tell us what to call you.')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('offers to continue a tasting started on this phone', () => {
    window.localStorage.setItem(LAST_SEAT_STORAGE_KEY, 'seat_tok_7Qx2mPz9');
    render(<JoinForm />);
    expect(screen.getByRole('link', { name: 'Continue your tasting' }).getAttribute('href')).toBe('/t/seat_tok_7Qx2mPz9');
    fireEvent.click(screen.getByRole('button', { name: 'Join a different tasting' }));
    expect(screen.queryByRole('link', { name: 'Continue your tasting' })).toBeNull();
    expect(window.localStorage.getItem(LAST_SEAT_STORAGE_KEY)).toBeNull();
  });

  // A walk found the same phone could join again after submitting, silently making a second seat
  // for the same person. A shared tablet may seat the next taster, but only when asked to.
  describe('a phone that has already submitted for the tasting', () => {
    const submitted = () => ({ ...ratedSeatPayload(), seat: { displayName: 'Wren', consented: true, submitted: true } });
    const joined = (seatToken: string, joinCode = 'QX7K29') => window.localStorage.setItem(JOINED_SEATS_STORAGE_KEY, JSON.stringify([{ joinCode, seatToken }]));

    it('remembers the code each seat was joined with', async () => {
      vi.stubGlobal('fetch', vi.fn(async () => json(201, { seatToken: 'seat_tok_7Qx2mPz9' })));
      render(<JoinForm />);
      fill('QX7K29', 'Wren');
      fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
      await waitFor(() => expect(router.push).toHaveBeenCalled());
      expect(JSON.parse(window.localStorage.getItem(JOINED_SEATS_STORAGE_KEY)!)).toEqual([{ joinCode: 'QX7K29', seatToken: 'seat_tok_7Qx2mPz9' }]);
    });

    it('says so on opening the join link, joins nobody on "Join", and takes a new taster only when asked', async () => {
      joined('seat_tok_firstTaster1');
      const fetchMock = vi.fn(async (url: string) => (url === '/api/v1/tastings/join' ? json(201, { seatToken: 'seat_tok_secondTaster' }) : json(200, submitted())));
      vi.stubGlobal('fetch', fetchMock);
      render(<JoinForm initialCode="qx7k29" />);
      await screen.findByText('This phone has already submitted answers for this tasting, as Wren.');
      expect(fetchMock.mock.calls[0][0]).toBe('/api/v1/tastings/seats/seat_tok_firstTaster1');

      fireEvent.change(screen.getByLabelText('Your name'), { target: { value: 'Wren' } });
      fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
      await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(2));
      await screen.findByText(/already submitted answers for this tasting/);
      expect(fetchMock.mock.calls.map((c) => c[0])).not.toContain('/api/v1/tastings/join');
      expect(router.push).not.toHaveBeenCalled();

      fireEvent.click(screen.getByRole('button', { name: 'Start as a new taster on this phone' }));
      expect(screen.queryByText(/already submitted answers/)).toBeNull();
      expect((screen.getByLabelText('Your name') as HTMLInputElement).value).toBe('');
      fireEvent.change(screen.getByLabelText('Your name'), { target: { value: 'Rowan' } });
      fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
      await waitFor(() => expect(router.push).toHaveBeenCalledWith('/t/seat_tok_secondTaster'));
      const joinCall = fetchMock.mock.calls.find((c) => c[0] === '/api/v1/tastings/join') as unknown as [string, RequestInit];
      expect(JSON.parse(String(joinCall[1].body))).toEqual({ joinCode: 'QX7K29', displayName: 'Rowan' });
    });

    it('joins at once when the seat joined here has not been submitted, or was for another tasting', async () => {
      joined('seat_tok_firstTaster1');
      window.localStorage.setItem(JOINED_SEATS_STORAGE_KEY, JSON.stringify([{ joinCode: 'AAAAAA', seatToken: 'seat_tok_otherTasting' }, { joinCode: 'QX7K29', seatToken: 'seat_tok_firstTaster1' }]));
      const fetchMock = vi.fn(async (url: string) => (url === '/api/v1/tastings/join' ? json(201, { seatToken: 'seat_tok_again000001' }) : json(200, ratedSeatPayload())));
      vi.stubGlobal('fetch', fetchMock);
      render(<JoinForm />);
      fill('QX7K29', 'Wren');
      fireEvent.click(screen.getByRole('button', { name: 'Join the tasting' }));
      await waitFor(() => expect(router.push).toHaveBeenCalledWith('/t/seat_tok_again000001'));
      expect(fetchMock.mock.calls.map((c) => c[0])).toEqual(['/api/v1/tastings/seats/seat_tok_firstTaster1', '/api/v1/tastings/join']);
      expect(screen.queryByText(/already submitted answers/)).toBeNull();
    });
  });
});
