import 'server-only';
/** Tastings from the organiser's side: create, open, invite, close. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { randomInt } from 'node:crypto';
import { getEm } from '@/lib/db';
import { LockMode } from '@mikro-orm/core';
import { Membership, TastingSample, TastingSeat, Tasting, SensoryAttributeDef, Trial, Variant } from '@/entities';
import type { TastingEntity } from '@/entities/Tasting';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed } from '@/lib/errors';
import { hashSecret, newSecret } from '@/lib/secrets';
import { sendMail, escapeHtml } from '@/lib/mail';
import { env } from '@/lib/env';
import { createDefaultAttributeLibrary, HEDONIC_9_POINT, makeIntensityLine, makeJustAboutRightScale, drawBlindingCodes, servingOrderForSeat, shuffled, treatmentLetter, TRIANGLE_ORDERS } from '@/lib/sensory';
import type { CreateAttributeInput, CreateTastingInput } from './schema';
import { titleBlindingProblem, type ServedCup } from './vocabulary';

export const SEAT_TOKEN_PREFIX = 'sws_';
/** Letters and digits that cannot be misread for each other (no 0/O, 1/I/L). */
const JOIN_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';

export async function addDefaultAttributes(em: EntityManager, workspaceId: string): Promise<void> {
  for (const a of createDefaultAttributeLibrary()) {
    em.create(SensoryAttributeDef, {
      workspace: workspaceId, libraryKey: a.id, name: a.name, instruction: a.tasterInstruction, modality: a.modality, scale: a.scale,
      formulationCaution: a.formulationCaution ?? null,
    });
  }
  await em.flush();
}

/** Checks a tasting's variants and attributes against the trial and the workspace library. */
async function checkTastingInput(em: EntityManager, actor: Actor, trialId: string, input: CreateTastingInput): Promise<void> {
  const variants = await em.find(Variant, { ...inWorkspace(actor), trial: trialId, id: { $in: input.variantIds }, removedAt: null });
  if (variants.length !== input.variantIds.length) throw new ValidationFailed('Choose variants of this trial.', { variantIds: ['Choose variants of this trial.'] });
  const trial = await em.findOneOrFail(Trial, { ...inWorkspace(actor), id: trialId }, { populate: ['baseFormula'] });
  const labels = (await em.find(Variant, { ...inWorkspace(actor), trial: trialId }, { fields: ['label'] })).map((v) => v.label);
  const leak = titleBlindingProblem(input.title, { variantLabels: labels, formulaName: trial.baseFormula.name });
  if (leak) throw new ValidationFailed(leak, { title: [leak] });
  const attributeIds = [...input.attributeIds, ...(input.rankingAttributeId ? [input.rankingAttributeId] : [])];
  if (attributeIds.length) {
    const found = await em.count(SensoryAttributeDef, { ...inWorkspace(actor), id: { $in: attributeIds } });
    if (found !== new Set(attributeIds).size) throw new ValidationFailed('Choose attributes from this workspace’s library.', { attributeIds: ['Choose attributes from this workspace’s library.'] });
  }
}

/** The set-up fields of a tasting, as stored. */
function setupColumns(input: CreateTastingInput) {
  return {
    title: input.title, place: input.place ?? null, startsAt: input.startsAt ? new Date(input.startsAt) : null,
    method: input.method, notice: input.notice, attributeIds: input.method === 'rated' ? input.attributeIds : [],
    rankingAttributeId: input.method === 'ranking' ? input.rankingAttributeId ?? null : null,
  };
}

/** Draws the sample codes and the serving design for a tasting's variants. */
async function drawSamples(tx: EntityManager, actor: Actor, session: TastingEntity, input: CreateTastingInput): Promise<void> {
  // Rated and ranking samples carry one code each; triangle cups are coded per seat.
  const codes = input.method === 'triangle' ? [] : drawBlindingCodes(input.variantIds.length);
  const samples = input.variantIds.map((variantId, i) =>
    tx.create(TastingSample, { workspace: actor.workspaceId, session, variant: variantId, code: codes[i] ?? null, position: i }),
  );
  await tx.flush();
  // Letters are assigned at random, so no variant is always served first in the design.
  const order = shuffled(samples.map((s) => s.id));
  session.design =
    input.method === 'triangle'
      ? { treatments: [{ letter: 'A', sampleId: order[0] }, { letter: 'B', sampleId: order[1] }], triangleCycle: shuffled([...TRIANGLE_ORDERS]) }
      : { treatments: order.map((sampleId, i) => ({ letter: treatmentLetter(i), sampleId })) };
  await tx.flush();
}

export async function createTasting(actor: Actor, trialId: string, input: CreateTastingInput): Promise<{ tastingId: string }> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!trial) throw notFound('trial');
  await checkTastingInput(em, actor, trialId, input);
  return em.transactional(async (tx) => {
    const session = tx.create(Tasting, { workspace: actor.workspaceId, trial, ...setupColumns(input), design: {}, createdBy: actor.userId });
    await tx.flush();
    await drawSamples(tx, actor, session, input);
    return { tastingId: session.id };
  });
}

/** Locks a tasting that is still being set up; one that has opened keeps its set-up (409). */
async function loadDraftForUpdate(tx: EntityManager, actor: Actor, tastingId: string) {
  const s = await tx.findOne(Tasting, { ...inWorkspace(actor), id: tastingId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!s) throw notFound('tasting');
  if (s.state !== 'draft') throw new Conflict('Only a tasting that is still being set up can be changed or discarded: this one has opened, and its codes and answers stay as they are.');
  return s;
}

/** Replaces a draft tasting's set-up; samples and codes are drawn afresh (nobody has seen them yet). */
export async function updateTasting(actor: Actor, tastingId: string, input: CreateTastingInput): Promise<void> {
  const em = await getEm();
  const current = await em.findOne(Tasting, { ...inWorkspace(actor), id: tastingId });
  if (!current) throw notFound('tasting');
  const trialId = current.trial.id;
  await checkTastingInput(em, actor, trialId, input);
  await em.transactional(async (tx) => {
    const s = await loadDraftForUpdate(tx, actor, tastingId);
    await tx.nativeDelete(TastingSample, { session: s.id });
    tx.assign(s, { ...setupColumns(input), design: {} });
    await tx.flush();
    await drawSamples(tx, actor, s, input);
  });
}

/** Discards a tasting that never opened: it has no seats and no answers, so nothing is lost but the set-up. */
export async function discardTasting(actor: Actor, tastingId: string): Promise<{ trialId: string }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const s = await loadDraftForUpdate(tx, actor, tastingId);
    const trialId = s.trial.id;
    await tx.nativeDelete(TastingSample, { session: s.id });
    await tx.nativeDelete(Tasting, { id: s.id });
    return { trialId };
  });
}

/**
 * A staff taster back to their own seat (the e-mailed link is lost): a fresh seat link, and the old
 * one stops working. Only the seat holder, only while the tasting takes answers.
 */
export async function renewMySeatLink(actor: Actor, tastingId: string): Promise<{ path: string }> {
  const em = await getEm();
  const seat = await em.findOne(TastingSeat, { ...inWorkspace(actor), session: tastingId, user: actor.userId }, { populate: ['session'] });
  if (!seat) throw notFound('seat');
  if (seat.session.state !== 'open') throw new Conflict('This tasting is not taking answers.');
  if (seat.submittedAt) throw new Conflict('You have already sent your answers for this tasting.');
  const token = newSecret(SEAT_TOKEN_PREFIX);
  seat.tokenHash = hashSecret(token);
  await em.flush();
  return { path: `/t/${token}` };
}

async function loadSession(em: EntityManager, actor: Actor, tastingId: string) {
  const s = await em.findOne(Tasting, { ...inWorkspace(actor), id: tastingId });
  if (!s) throw notFound('tasting');
  return s;
}

function newJoinCode(): string {
  return Array.from({ length: 6 }, () => JOIN_ALPHABET[randomInt(JOIN_ALPHABET.length)]).join('');
}

export async function openTasting(actor: Actor, tastingId: string): Promise<{ joinCode: string }> {
  const em = await getEm();
  const s = await loadSession(em, actor, tastingId);
  if (s.state !== 'draft') throw new Conflict(s.state === 'open' ? 'This tasting is already taking answers.' : 'A closed tasting cannot be reopened: its answers are locked.');
  for (let attempt = 0; attempt < 5; attempt++) {
    try {
      s.joinCode = newJoinCode();
      s.state = 'open';
      s.openedAt = new Date();
      await em.flush();
      return { joinCode: s.joinCode };
    } catch (err) {
      if ((err as { code?: string }).code !== '23505') throw err;
      em.clear();
    }
  }
  throw new Conflict('Could not find a free join code; try again.');
}

/** Closing locks the answers; seats that did not submit stay, marked as partial. */
export async function closeTasting(actor: Actor, tastingId: string): Promise<{ openSeats: number }> {
  const em = await getEm();
  const s = await loadSession(em, actor, tastingId);
  if (s.state === 'closed') throw new Conflict('This tasting is already closed.');
  if (s.state === 'draft') throw new Conflict('Open the tasting before closing it.');
  const openSeats = await em.count(TastingSeat, { session: s.id, submittedAt: null });
  s.state = 'closed';
  s.closedAt = new Date();
  s.joinCode = null;
  await em.flush();
  return { openSeats };
}

/**
 * Adds a seat in a transaction that locks the session, so seat numbers (and with them the
 * balanced serving orders and the triangle codes) never collide.
 */
export async function addSeat(tx: EntityManager, tastingId: string, seat: { kind: 'staff' | 'guest'; userId?: string; displayName: string }): Promise<{ token: string; seatId: string }> {
  const session = await tx.findOneOrFail(Tasting, { id: tastingId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (session.state !== 'open') throw new Conflict('This tasting is not taking answers.');
  const seatIndex = await tx.count(TastingSeat, { session: tastingId });
  const samples = await tx.find(TastingSample, { session: tastingId }, { orderBy: { position: 'asc' } });
  const byId = new Map(samples.map((s) => [s.id, s]));
  const treatments = session.design.treatments ?? [];
  let servingOrder: ServedCup[];
  let designRow: string;
  if (session.method === 'triangle') {
    const cycle = session.design.triangleCycle ?? [...TRIANGLE_ORDERS];
    designRow = cycle[seatIndex % cycle.length];
    const seats = await tx.find(TastingSeat, { session: tastingId }, { fields: ['servingOrder'] });
    const used = seats.flatMap((s) => s.servingOrder.map((c) => c.code));
    const codes = drawBlindingCodes(3, { exclude: used });
    const sampleFor = (letter: string) => treatments.find((t) => t.letter === letter)!.sampleId;
    servingOrder = [...designRow].map((letter, i) => ({ code: codes[i], sampleId: sampleFor(letter) }));
  } else {
    const rows = servingOrderForSeat(seatIndex, treatments.length);
    designRow = rows.map((i) => treatments[i].letter).join('');
    servingOrder = rows.map((i) => {
      const sample = byId.get(treatments[i].sampleId)!;
      return { code: sample.code!, sampleId: sample.id };
    });
  }
  const token = newSecret(SEAT_TOKEN_PREFIX);
  const row = tx.create(TastingSeat, {
    workspace: session.workspace.id, session, seatIndex, kind: seat.kind, user: seat.userId ?? null,
    displayName: seat.displayName, tokenHash: hashSecret(token), servingOrder, designRow,
  });
  await tx.flush();
  return { token, seatId: row.id };
}

/** Staff tasters of this workspace get a seat each and an e-mail with their own link. */
export async function inviteStaffTasters(actor: Actor, tastingId: string, userIds: string[]): Promise<{ invited: number }> {
  const em = await getEm();
  const session = await loadSession(em, actor, tastingId);
  const members = await em.find(Membership, { ...inWorkspace(actor), user: { $in: userIds }, active: true }, { populate: ['user'] });
  if (members.length !== new Set(userIds).size) throw new ValidationFailed('Invite members of this workspace.', { userIds: ['Invite active members of this workspace.'] });
  const already = await em.find(TastingSeat, { session: tastingId, user: { $in: userIds } });
  const skip = new Set(already.map((s) => s.user?.id));
  let invited = 0;
  for (const m of members) {
    const user = m.user;
    if (skip.has(user.id)) continue;
    const { token } = await em.transactional((tx) => addSeat(tx, tastingId, { kind: 'staff', userId: user.id, displayName: user.name }));
    const link = `${env().APP_URL}/t/${token}`;
    await sendMail({
      workspaceId: actor.workspaceId,
      to: user.email,
      subject: `Tasting: ${session.title}`,
      text: [`You are seated at the tasting “${session.title}”${session.place ? ` in ${session.place}` : ''}.`, '', 'Open this link on your phone when the samples arrive (it is yours alone; do not forward it):', link].join('\n'),
      html: `<p>You are seated at the tasting “${escapeHtml(session.title)}”.</p><p><a href="${escapeHtml(link)}">Open your tasting</a> on your phone when the samples arrive. The link is yours alone.</p>`,
    });
    invited++;
  }
  return { invited };
}

/** Guests join with the short code shown on the organiser's screen; they get an identity for this session only. */
export async function joinAsGuest(input: { joinCode: string; displayName: string }): Promise<{ seatToken: string }> {
  const em = await getEm();
  const session = await em.findOne(Tasting, { joinCode: input.joinCode, state: 'open' });
  if (!session) throw notFound('tasting with that code');
  const { token } = await em.transactional((tx) => addSeat(tx, session.id, { kind: 'guest', displayName: input.displayName }));
  return { seatToken: token };
}

/** A workspace's own attribute, on one of the three scales the phone flow knows. */
export async function createAttribute(actor: Actor, input: CreateAttributeInput): Promise<{ attributeId: string }> {
  const em = await getEm();
  const id = `own-${input.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').slice(0, 40)}`;
  const scale =
    input.scale === 'hedonic' ? HEDONIC_9_POINT : input.scale === 'jar' ? makeJustAboutRightScale(id, input.name) : makeIntensityLine(id, input.name, input.lowAnchor!, input.highAnchor!);
  const row = em.create(SensoryAttributeDef, {
    workspace: actor.workspaceId, libraryKey: null, name: input.name, instruction: input.instruction,
    modality: input.scale === 'hedonic' ? 'liking' : input.scale === 'jar' ? 'just-about-right' : 'intensity', scale,
  });
  await em.flush();
  return { attributeId: row.id };
}
