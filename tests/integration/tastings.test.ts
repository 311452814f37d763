/** Tastings against the real database: blinding, balanced orders, exactly-once answers, closing, restarts, leaks. */
import { describe, it, expect, beforeAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { createWorkspace, callRoute, actorOf, waitForMail, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';
import { createTrial, planVariants } from '@/lib/trials/mutations';
import { createTasting, openTasting, closeTasting, joinAsGuest, inviteStaffTasters } from '@/lib/tastings/mutations';
import { listAttributes, getTasting, getServingSheet, listTrialTastings } from '@/lib/tastings/queries';
import { recordAnswer, recordConsent, tasterView, submitSeat } from '@/lib/taster/seat';
import * as joinRoute from '@/app/api/v1/tastings/join/route';
import * as viewRoute from '@/app/api/v1/tastings/seats/[seatToken]/route';
import * as answersRoute from '@/app/api/v1/tastings/seats/[seatToken]/answers/route';
import * as submitRoute from '@/app/api/v1/tastings/seats/[seatToken]/submit/route';
import { answerRequestBody } from '@/lib/taster/answer-queue';
import * as summaryRoute from '@/app/api/v1/tastings/[tastingId]/summary.csv/route';
import * as rawRoute from '@/app/api/v1/tastings/[tastingId]/answers.csv/route';
import * as resultsRoute from '@/app/api/v1/tastings/[tastingId]/results/route';
import { analyseResults, loadResultsSetup } from '@/lib/results/queries';
import { getEm } from '@/lib/db';
import { TastingAnswer, Variant, Formula } from '@/entities';
import { isAllowedBlindingCode } from '@/lib/sensory';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
beforeAll(async () => {
  a = await createWorkspace('Panels');
  b = await createWorkspace('Other panels');
});

async function trialWith(n: number) {
  const dev = actorOf(a, 'developer');
  const { trialId } = await createTrial(dev, { title: 'Panel trial', question: 'Which is liked best?', formulaId: await createFixtureFormula(a) });
  // One factor at three settings plus the base gives up to five variants.
  await planVariants(dev, trialId, { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.2 }, { factor: 'acid_dose', low: 3, high: 7 }], centrePoint: false });
  const em = await getEm();
  const variants = await em.find(Variant, { trial: trialId }, { orderBy: { position: 'asc' } });
  return { trialId, variantIds: variants.slice(0, n).map((v) => v.id) };
}

async function ratedSession(n: number) {
  const dev = actorOf(a, 'developer');
  const t = await trialWith(n);
  const attrs = await listAttributes(dev);
  const liking = attrs.find((x) => x.libraryKey === 'overall-liking')!;
  const firmness = attrs.find((x) => x.libraryKey === 'set-firmness')!;
  const { tastingId } = await createTasting(dev, t.trialId, { title: 'Blind tasting', method: 'rated', variantIds: t.variantIds, attributeIds: [liking.id, firmness.id], notice: 'Contains fruit.' });
  const { joinCode } = await openTasting(dev, tastingId);
  return { ...t, tastingId, joinCode, liking, firmness };
}

const seat = async (joinCode: string, name = 'Guest') => {
  const { seatToken } = await joinAsGuest({ joinCode, displayName: name });
  await recordConsent(seatToken);
  return seatToken;
};

describe('submitting a seat', () => {
  // A walk found a preference ranking lost on every phone: the phone sent attributeId "" (refused, 422),
  // then "Submit" still answered "Thank you" with nothing stored. Only stored answers may be submitted.
  it('a preference ranking sent as the phone sends it is stored, and the seat can then be submitted', async () => {
    const dev = actorOf(a, 'developer');
    const t = await trialWith(3);
    const { tastingId } = await createTasting(dev, t.trialId, { title: 'Preference order', method: 'ranking', variantIds: t.variantIds, attributeIds: [], notice: 'Contains fruit.' });
    const { joinCode } = await openTasting(dev, tastingId);
    const token = await seat(joinCode, 'Ranker');
    const view = await tasterView(token);
    expect(view.ranking?.attributeId).toBeNull();
    const submit = () => callRoute(submitRoute.POST, { method: 'POST', path: '', caller: { kind: 'outsider' }, params: { seatToken: token } });

    const early = await submit();
    expect(early.status).toBe(422);
    expect(early.body.error.message).toBe('Your order of the samples has not reached the organiser yet: save it again, then submit.');

    const order = view.samples.map((x) => x.code).reverse();
    const body = answerRequestBody({ idempotencyKey: randomUUID(), answer: { kind: 'ranking', attributeId: view.ranking?.attributeId ?? '', ranking: order }, attempts: 0 });
    const put = await callRoute(answersRoute.PUT, { method: 'PUT', path: '', caller: { kind: 'outsider' }, params: { seatToken: token }, body });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect((await submit()).status).toBe(200);
    const rows = await (await getEm()).fork().find(TastingAnswer, { session: tastingId });
    expect(rows.map((r) => r.ranking)).toEqual([order]);
  });

  it('refuses a seat that has not agreed, or whose answers are incomplete, and marks nothing submitted', async () => {
    const s = await ratedSession(2);
    const { seatToken: unconsented } = await joinAsGuest({ joinCode: s.joinCode, displayName: 'Not agreed' });
    await expect(submitSeat(unconsented)).rejects.toThrow('Agree to take part first.');
    const half = await seat(s.joinCode, 'Half done');
    const v = await tasterView(half);
    await recordAnswer(half, { idempotencyKey: randomUUID(), code: v.samples[0].code, attributeId: s.liking.id, value: 6 });
    await recordAnswer(half, { idempotencyKey: randomUUID(), code: v.samples[0].code, attributeId: s.firmness.id, value: 5 });
    await recordAnswer(half, { idempotencyKey: randomUUID(), code: v.samples[1].code, attributeId: s.liking.id, value: 6 });
    await expect(submitSeat(half)).rejects.toThrow(`Some answers have not reached the organiser yet (sample ${v.samples[1].code}): answer them again, then submit.`);
    const progress = await getTasting(actorOf(a, 'developer'), s.tastingId);
    expect(progress.seats.map((x) => x.status)).not.toContain('submitted');
    await recordAnswer(half, { idempotencyKey: randomUUID(), code: v.samples[1].code, attributeId: s.firmness.id, value: 5 });
    await submitSeat(half);
    expect((await getTasting(actorOf(a, 'developer'), s.tastingId)).seats.find((x) => x.displayName === 'Half done')?.status).toBe('submitted');
  });
});

describe('blinding and serving orders', () => {
  it('gives each sample a unique allowed three-digit code and Williams-balanced orders seat by seat', async () => {
    const s = await ratedSession(4);
    for (let i = 0; i < 4; i++) await seat(s.joinCode, `Seat ${i + 1}`);
    const sheet = await getServingSheet(actorOf(a, 'developer'), s.tastingId);
    const codes = sheet.samples.map((x) => x.code!);
    expect(new Set(codes).size).toBe(4);
    // Source: ISO 13299 ("three-digit random numbers"); excluded patterns: common practice, no published source.
    for (const c of codes) {
      expect(c).toMatch(/^\d{3}$/);
      expect(isAllowedBlindingCode(c)).toBe(true);
    }
    // Source: Williams (1949); MacFie et al. (1989): for 4 samples the rows are ABDC / BCAD / CDBA / DACB.
    expect(sheet.seats.map((x) => x.designRow)).toEqual(['ABDC', 'BCAD', 'CDBA', 'DACB']);
    for (let pos = 0; pos < 4; pos++) expect(new Set(sheet.seats.map((x) => x.cups[pos].code)).size).toBe(4);
  });

  it('balances the six triangle orders across seats and codes every cup on its own', async () => {
    const dev = actorOf(a, 'developer');
    const t = await trialWith(2);
    const { tastingId } = await createTasting(dev, t.trialId, { title: 'Triangle', method: 'triangle', variantIds: t.variantIds, attributeIds: [], notice: 'Contains fruit.' });
    const { joinCode } = await openTasting(dev, tastingId);
    for (let i = 0; i < 6; i++) await seat(joinCode, `T${i}`);
    const sheet = await getServingSheet(dev, tastingId);
    // Source: ISO 4120 — the six orders AAB, ABA, BAA, ABB, BAB, BBA, each used equally often.
    expect(sheet.seats.map((x) => x.designRow).sort()).toEqual(['AAB', 'ABA', 'ABB', 'BAA', 'BAB', 'BBA']);
    const allCodes = sheet.seats.flatMap((x) => x.cups.map((c) => c.code));
    expect(new Set(allCodes).size).toBe(18);
  });
});

describe('answers', () => {
  it('an answer retried ten times is stored once', async () => {
    const s = await ratedSession(3);
    const token = await seat(s.joinCode);
    const view = await tasterView(token);
    const answer = { idempotencyKey: randomUUID(), code: view.samples[0].code, attributeId: s.liking.id, value: 7 };
    const results = [];
    for (let i = 0; i < 10; i++) results.push(await recordAnswer(token, answer));
    expect(results.filter((r) => !r.duplicate)).toHaveLength(1);
    const em = await getEm();
    expect(await em.count(TastingAnswer, { session: s.tastingId })).toBe(1);
    // A change of mind (a new key) replaces the value; still one row per (seat, sample, attribute).
    await recordAnswer(token, { ...answer, idempotencyKey: randomUUID(), value: 8 });
    const rows = await em.fork().find(TastingAnswer, { session: s.tastingId });
    expect(rows).toHaveLength(1);
    expect(rows[0].value).toBe(8);
  });

  it('refuses values off the scale, codes not served to the seat, and answers before consent', async () => {
    const s = await ratedSession(2);
    const { seatToken } = await joinAsGuest({ joinCode: s.joinCode, displayName: 'No consent yet' });
    const view = await tasterView(seatToken);
    const code = view.samples[0].code;
    await expect(recordAnswer(seatToken, { idempotencyKey: randomUUID(), code, attributeId: s.liking.id, value: 7 })).rejects.toMatchObject({ status: 409 });
    await recordConsent(seatToken);
    // Source: Peryam & Pilgrim (1957): the hedonic scale runs 1 to 9.
    await expect(recordAnswer(seatToken, { idempotencyKey: randomUUID(), code, attributeId: s.liking.id, value: 10 })).rejects.toThrow(/not on the scale/);
    await expect(recordAnswer(seatToken, { idempotencyKey: randomUUID(), code: '999', attributeId: s.liking.id, value: 5 })).rejects.toThrow(/not one of your samples/);
    expect(await (await getEm()).count(TastingAnswer, { session: s.tastingId })).toBe(0);
  });

  it('closing locks the answers: a late answer gets 409 and changes nothing; unfinished seats show as partial', async () => {
    const s = await ratedSession(2);
    const done = await seat(s.joinCode, 'Done');
    const late = await seat(s.joinCode, 'Late');
    const v = await tasterView(done);
    for (const sample of v.samples) {
      await recordAnswer(done, { idempotencyKey: randomUUID(), code: sample.code, attributeId: s.liking.id, value: 6 });
      await recordAnswer(done, { idempotencyKey: randomUUID(), code: sample.code, attributeId: s.firmness.id, value: 5 });
    }
    await submitSeat(done);
    const { openSeats } = await closeTasting(actorOf(a, 'developer'), s.tastingId);
    expect(openSeats).toBe(1);
    const res = await callRoute(answersRoute.PUT, {
      method: 'PUT', path: '', caller: { kind: 'outsider' }, params: { seatToken: late },
      body: { idempotencyKey: randomUUID(), code: v.samples[0].code, attributeId: s.liking.id, value: 9 },
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/closed/);
    const progress = await getTasting(actorOf(a, 'developer'), s.tastingId);
    expect(progress.seats.map((x) => x.status)).toEqual(['submitted', 'partial']);
    // The set-up is read in one statement: seats in seat order with their answers counted, times as ISO strings.
    expect(progress.seats.map((x) => [x.seatIndex, x.displayName, x.answered, x.consented])).toEqual([[0, 'Done', 4, true], [1, 'Late', 0, true]]);
    const times = [progress.createdAt, progress.openedAt, progress.closedAt, ...progress.seats.map((x) => x.lastSeenAt).filter((t) => t !== null)];
    expect(times.length).toBeGreaterThan(3);
    for (const t of times) expect(t).toBe(new Date(String(t)).toISOString());
    await expect(getTasting(actorOf(b, 'developer'), s.tastingId)).rejects.toMatchObject({ status: 404 });
    expect(await (await getEm()).count(TastingAnswer, { session: s.tastingId })).toBe(4);
    // The trial page's list counts the seats and the submitted ones, scoped to the workspace.
    const listed = await listTrialTastings(actorOf(a, 'developer'), s.trialId);
    expect(listed.map((t) => [t.id, t.trialId, t.state, t.seats, t.submitted])).toEqual([[s.tastingId, s.trialId, 'closed', 2, 1]]);
    expect((await listTrialTastings(actorOf(a, 'developer'))).map((t) => t.id)).toContain(s.tastingId);
    expect(await listTrialTastings(actorOf(b, 'developer'), s.trialId)).toEqual([]);
    expect(await listTrialTastings(actorOf(a, 'developer'), 'not-a-uuid')).toEqual([]);
  });

  it('answers survive a PostgreSQL restart during the session', async () => {
    const s = await ratedSession(2);
    const token = await seat(s.joinCode);
    const v = await tasterView(token);
    await recordAnswer(token, { idempotencyKey: randomUUID(), code: v.samples[0].code, attributeId: s.liking.id, value: 5 });
    const bin = process.env.SETWELL_PG_BIN!;
    const data = process.env.SETWELL_PG_DATA!;
    const asPostgres = process.getuid?.() === 0 ? ['runuser', ['-u', 'postgres', '--', `${bin}/pg_ctl`]] : [`${bin}/pg_ctl`, []];
    execFileSync(asPostgres[0] as string, [...(asPostgres[1] as string[]), '-D', data, '-m', 'fast', '-w', 'restart', '-l', `${path.dirname(data)}/log/postgres.log`], { stdio: 'ignore' });
    // The pool's old connections died with the server: the next call may fail once, as a phone's retry would.
    const retry = async <T>(fn: () => Promise<T>): Promise<T> => {
      for (let i = 0; ; i++) {
        try {
          return await fn();
        } catch (err) {
          if (i >= 5) throw err;
          await new Promise((r) => setTimeout(r, 300));
        }
      }
    };
    await retry(() => recordAnswer(token, { idempotencyKey: randomUUID(), code: v.samples[1].code, attributeId: s.liking.id, value: 8 }));
    const after = await retry(() => tasterView(token));
    expect(after.answers.map((x) => x.value).sort()).toEqual([5, 8]);
  });
});

describe('who tastes', () => {
  it('staff tasters get an e-mail with their own link; a wrong join code is a plain 404', async () => {
    const s = await ratedSession(2);
    const { invited } = await inviteStaffTasters(actorOf(a, 'developer'), s.tastingId, [a.people.taster.userId]);
    expect(invited).toBe(1);
    const mail = await waitForMail(a.people.taster.email);
    const token = mail.text.match(/\/t\/(sws_[A-Za-z0-9_-]+)/)?.[1];
    expect(token).toBeTruthy();
    const view = await callRoute(viewRoute.GET, { method: 'GET', path: '', caller: { kind: 'outsider' }, params: { seatToken: token! } });
    expect(view.status).toBe(200);
    expect(view.body.seat.displayName).toBe(`taster ${a.name.split(' ').at(-1)}`);
    const wrong = await callRoute(joinRoute.POST, { method: 'POST', path: '', caller: { kind: 'outsider' }, body: { joinCode: 'ZZZZZZ', displayName: 'X' }, headers: { 'x-forwarded-for': '198.51.100.77' } });
    expect(wrong.status).toBe(404);
  });

  it('join-code guesses are rate-limited per address', async () => {
    let last = 0;
    for (let i = 0; i < 21; i++) {
      const res = await callRoute(joinRoute.POST, { method: 'POST', path: '', caller: { kind: 'outsider' }, body: { joinCode: 'QQQQQQ', displayName: 'Guesser' }, headers: { 'x-forwarded-for': '203.0.113.99' } });
      last = res.status;
    }
    expect(last).toBe(429);
  });
});

describe('exports', () => {
  it('raw answers in long format and each summary table as CSV; an unknown table is a 422', async () => {
    const s = await ratedSession(2);
    let one = '';
    for (const name of ['One', 'Two', 'Three']) {
      const token = await seat(s.joinCode, name);
      if (name === 'One') one = token;
      const v = await tasterView(token);
      for (const [i, x] of v.samples.entries()) {
        await recordAnswer(token, { idempotencyKey: randomUUID(), code: x.code, attributeId: s.liking.id, value: 5 + i + name.length % 2 });
        await recordAnswer(token, { idempotencyKey: randomUUID(), code: x.code, attributeId: s.firmness.id, value: 4 + i });
      }
    }
    const get = async (route: typeof summaryRoute | typeof rawRoute, query = '') => {
      const res = await route.GET(new Request(`http://127.0.0.1/x${query}`, { headers: { cookie: a.people.developer.sessionCookie } }), { params: Promise.resolve({ tastingId: s.tastingId }) });
      return { status: res.status, lines: (await res.text()).trim().split(/\r?\n/) };
    };
    await submitSeat(one);
    const raw = await get(rawRoute);
    expect(raw.lines[0]).toBe('session,seat,seat_status,seat_submitted_at,code,variant,attribute,value,correct,answered_at');
    expect(raw.lines).toHaveLength(1 + 3 * 2 * 2);
    // Each row says whether its seat submitted, when, and when the answer was given (ISO 8601, UTC).
    const iso = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;
    const rows = raw.lines.slice(1).map((l) => l.split(','));
    expect(rows.filter((r) => r[2] === 'submitted')).toHaveLength(4);
    expect(rows.filter((r) => r[2] === 'partial')).toHaveLength(8);
    for (const r of rows) {
      expect(r[3] === '' ? r[2] : iso.test(r[3]) && r[2]).toBe(r[2] === 'submitted' ? 'submitted' : 'partial');
      expect(r[9]).toMatch(iso);
      expect(r[8]).toBe('');
    }
    const anova = await get(summaryRoute, '?table=anova');
    expect(anova.lines[0]).toBe('attribute,source,sum_of_squares,df,mean_square,f,p');
    // The screen's words, not the statistics module's keys.
    expect(anova.lines.filter((l) => l.includes(',samples,'))).toHaveLength(2);
    expect(anova.lines.filter((l) => l.includes(',assessors,'))).toHaveLength(2);
    expect(anova.lines.join('\n')).not.toMatch(/treatments|blocks/);
    const means = await get(summaryRoute);
    expect(means.lines[0]).toContain('tukey_letters');
    expect((await get(summaryRoute, '?table=bogus')).status).toBe(422);
    // The API's analysis carries each pair's Tukey p; the page's (which shows letters) leaves them out.
    const api = await resultsRoute.GET(new Request('http://127.0.0.1/x', { headers: { cookie: a.people.developer.sessionCookie } }), { params: Promise.resolve({ tastingId: s.tastingId }) });
    const apiPairs = (await api.json()).analysis.attributes[0].comparison.pairs as Array<{ p: number | null }>;
    expect(apiPairs.length).toBeGreaterThan(0);
    for (const pair of apiPairs) expect(pair.p).toBeTypeOf('number');
    const dev = actorOf(a, 'developer');
    const page = await analyseResults(dev, await loadResultsSetup(dev, s.tastingId));
    expect(page.attributes[0].comparison.pairs.every((pair) => pair.p === null)).toBe(true);
    expect(page.attributes[0].comparison.letters).toEqual((await (await resultsRoute.GET(new Request('http://127.0.0.1/x', { headers: { cookie: a.people.developer.sessionCookie } }), { params: Promise.resolve({ tastingId: s.tastingId }) })).json()).analysis.attributes[0].comparison.letters);
  });

  it('a triangle answer names the cup chosen as odd, its variant and whether it was right', async () => {
    const dev = actorOf(a, 'developer');
    const t = await trialWith(2);
    const { tastingId } = await createTasting(dev, t.trialId, { title: 'Triangle export', method: 'triangle', variantIds: t.variantIds, attributeIds: [], notice: 'Contains fruit.' });
    const { joinCode } = await openTasting(dev, tastingId);
    const sheet = async () => getServingSheet(dev, tastingId);
    const right = await seat(joinCode, 'Right');
    const wrong = await seat(joinCode, 'Wrong');
    const seats = (await sheet()).seats;
    // The odd cup is the one whose sample is served once (ISO 4120).
    const cupsOf = (i: number) => seats[i].cups;
    const oddOf = (i: number) => cupsOf(i).find((c) => cupsOf(i).filter((d) => d.variantLabel === c.variantLabel).length === 1)!;
    const evenOf = (i: number) => cupsOf(i).find((c) => c.code !== oddOf(i).code)!;
    await recordAnswer(right, { idempotencyKey: randomUUID(), oddCode: oddOf(0).code });
    await recordAnswer(wrong, { idempotencyKey: randomUUID(), oddCode: evenOf(1).code });
    const res = await rawRoute.GET(new Request('http://127.0.0.1/x', { headers: { cookie: a.people.developer.sessionCookie } }), { params: Promise.resolve({ tastingId }) });
    const [, ...lines] = (await res.text()).trim().split(/\r?\n/);
    const rows = lines.map((l) => l.split(','));
    expect(rows.map((r) => [r[1], r[4], r[5], r[6], r[7], r[8]])).toEqual([
      ['1', oddOf(0).code, oddOf(0).variantLabel, 'odd sample', '', 'yes'],
      ['2', evenOf(1).code, evenOf(1).variantLabel, 'odd sample', '', 'no'],
    ]);
  });
});

describe('seat tokens', () => {
  it('a made-up token, or a staff session without a token, reaches no seat', async () => {
    const s = await ratedSession(2);
    await seat(s.joinCode);
    const fake = await callRoute(viewRoute.GET, { method: 'GET', path: '', caller: { kind: 'outsider' }, params: { seatToken: 'sws_' + 'x'.repeat(43) } });
    expect(fake.status).toBe(404);
    const staff = await callRoute(viewRoute.GET, { method: 'GET', path: '', caller: { kind: 'session', person: a.people.admin }, params: { seatToken: 'not-a-token' } });
    expect(staff.status).toBe(404);
  });

  it('own attributes need words for both ends of an intensity line', async () => {
    const { createAttribute } = await import('@/lib/tastings/mutations');
    const { createAttributeSchema } = await import('@/lib/tastings/schema');
    expect(createAttributeSchema.safeParse({ name: 'Peel', instruction: 'Chew', scale: 'intensity', lowAnchor: 'Soft' }).success).toBe(false);
    const { attributeId } = await createAttribute(actorOf(a, 'developer'), createAttributeSchema.parse({ name: 'Peel chewiness', instruction: 'Chew', scale: 'intensity', lowAnchor: 'Tender', highAnchor: 'Chewy' }));
    const mine = (await listAttributes(actorOf(a, 'developer'))).find((x) => x.id === attributeId)!;
    expect(mine.libraryKey).toBeNull();
  });
});

describe('nothing unblinds a sample', () => {
  it('no taster response carries a variant name, description, id, formula name or sample id', async () => {
    const s = await ratedSession(3);
    const token = await seat(s.joinCode);
    const em = await getEm();
    const variants = await em.find(Variant, { id: { $in: s.variantIds } });
    const formulas = await em.find(Formula, { workspace: a.workspaceId });
    const sheet = await getServingSheet(actorOf(a, 'developer'), s.tastingId);
    const secrets = [
      ...variants.flatMap((v) => [v.id, v.description, `Variant ${v.label}`]),
      ...formulas.map((f) => f.name),
      ...sheet.samples.map((x) => x.sampleId),
      s.trialId,
      s.tastingId,
    ];
    const view = await tasterView(token);
    const responses: string[] = [JSON.stringify(view)];
    responses.push(JSON.stringify((await callRoute(viewRoute.GET, { method: 'GET', path: '', caller: { kind: 'outsider' }, params: { seatToken: token } })).body));
    responses.push(JSON.stringify((await callRoute(answersRoute.PUT, { method: 'PUT', path: '', caller: { kind: 'outsider' }, params: { seatToken: token }, body: { idempotencyKey: randomUUID(), code: view.samples[0].code, attributeId: s.liking.id, value: 6 } })).body));
    responses.push(JSON.stringify((await callRoute(answersRoute.PUT, { method: 'PUT', path: '', caller: { kind: 'outsider' }, params: { seatToken: token }, body: { idempotencyKey: randomUUID(), code: '000', attributeId: s.liking.id, value: 6 } })).body));
    for (const body of responses) for (const secret of secrets) expect(body).not.toContain(secret);
    expect(view.samples.every((x) => /^\d{3}$/.test(x.code))).toBe(true);
  });
});
