/**
 * An invented history for the models: three earlier trials of the reduced-sugar apricot spread,
 * cooked and tasted between March and July 2026. Together they form a face-centred central
 * composite design in four factors (sugar ratio, target soluble solids, LM pectin dose, lemon
 * juice dose): the two halves of a 2⁴ factorial, then the star points, each trial with two centre
 * points. Enough for a full quadratic with replicates, so the formula editor predicts and the
 * optimiser proposes at first sign-in.
 *
 * The responses come from a made-up "true" surface plus deterministic scatter. The chemistry is
 * kept plausible (common practice, no published source): low-methoxyl amidated pectin with calcium
 * sets at 42–50 % soluble solids; lemon juice takes the pH from about 3.8 to 3.45; more pectin and
 * solids give a firmer set and less weeping. Inserted in one flush (batched), not through the
 * one-by-one mutations, so seeding stays fast; every number is fixed, so every seed is the same.
 */
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Formula, FormulaRevision, Ingredient, Cook, TastingAnswer, TastingSample, TastingSeat, Tasting, SensoryAttributeDef, Trial, TrialStatusChange, Variant } from '@/entities';
import { compositionOf, labelDataOf } from '@/lib/ingredients/queries';
import { computeFormula } from '@/lib/formulas/compute';
import type { RevisionLine } from '@/lib/formulas/schema';
import type { FactorLevel } from '@/lib/trials/plan';
import { hashSecret, newSecret } from '@/lib/secrets';
import type { Actor } from '@/lib/permissions';
import { formatDate } from '@/lib/format/dates';

/** Deterministic scatter in [-1, 1]. */
function noise(seed: number): number {
  const x = Math.sin(seed * 91.345 + 47.853) * 43758.5453;
  return (x - Math.floor(x)) * 2 - 1;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Coded point: sugar ratio, target solids, pectin dose, lemon juice dose (−1, 0, +1). */
type Coded = [number, number, number, number];

const LEVELS = {
  sugarRatio: [0.3, 0.4, 0.5],
  targetSolidsPct: [42, 46, 50],
  pectinPerKgFruit: [7, 10, 13],
  lemonPerKgFruit: [20, 40, 60],
};
const level = (values: number[], coded: number) => values[coded + 1];

function halfFraction(sign: 1 | -1): Coded[] {
  const runs: Coded[] = [];
  for (const a of [-1, 1]) for (const b of [-1, 1]) for (const c of [-1, 1]) runs.push([a, b, c, sign * a * b * c]);
  return runs;
}
const STAR: Coded[] = [0, 1, 2, 3].flatMap((i) => [-1, 1].map((s) => [0, 1, 2, 3].map((j) => (j === i ? s : 0)) as Coded));
const CENTRE: Coded = [0, 0, 0, 0];

/** The made-up truth, in coded units. */
const TRUTH = {
  ph: ([a, b, , d]: Coded) => 3.62 - 0.16 * d - 0.03 * a + 0.02 * b + 0.04 * d * d,
  setTest: ([a, b, c]: Coded) => 3.1 + 0.9 * c + 0.45 * b + 0.25 * a - 0.35 * c * c + 0.2 * b * c,
  weeping: ([, b, c]: Coded) => 0.7 - 0.55 * c - 0.3 * b,
  firmness: ([a, b, c]: Coded) => 5.2 + 1.7 * c + 0.8 * b + 0.5 * a - 0.6 * c * c + 0.35 * b * c,
  tartness: ([a, b, , d]: Coded) => 4.6 + 1.2 * d - 0.7 * a - 0.25 * b + 0.3 * d * d,
  liking: ([a, b, c, d]: Coded) => 6.2 + 0.45 * a + 0.25 * b + 0.35 * c + 0.15 * d - 0.55 * c * c - 0.5 * d * d - 0.35 * a * a - 0.3 * b * b - 0.2 * a * d,
};

const HISTORY = [
  {
    title: 'Apricot spread: which of sugar, solids, pectin and lemon matter?',
    question: 'A first screen of the four things we can change: half of the sixteen corners and two centre cooks. Which of them move the set and the liking?',
    cookDay: '2026-03-11',
    panelDay: '2026-03-13',
    runs: [...halfFraction(1), CENTRE, CENTRE],
  },
  {
    title: 'Apricot spread: the other half of the corners',
    question: 'The screen left pairs of interactions tangled. Cooking the other eight corners separates them; two more centre cooks show the kitchen’s own scatter.',
    cookDay: '2026-05-06',
    panelDay: '2026-05-08',
    runs: [...halfFraction(-1), CENTRE, CENTRE],
  },
  {
    title: 'Apricot spread: is there a best middle?',
    question: 'The corners say the set and the liking bend. One factor at a time to its low and high end, everything else in the middle, to see where they turn.',
    cookDay: '2026-07-08',
    panelDay: '2026-07-10',
    runs: [...STAR, CENTRE, CENTRE],
  },
];

const TASTERS = ['Ada', 'Bram', 'Cleo', 'Dov', 'Esme', 'Finn', 'Gwen', 'Hale', 'Ivo', 'Juno'];
const SAMPLES_PER_SITTING = 5;
const NOTICE =
  'These are fruit spreads from our development kitchen, with fruit, sugar and pectin; the crackers contain wheat (gluten). Do not taste if you have an allergy or intolerance to any of these. Taking part is voluntary and you can stop at any time.';

function label(n: number): string {
  return String.fromCharCode(65 + n);
}

function describe([a, b, c, d]: Coded): string {
  const word = (x: number) => (x < 0 ? 'low' : x > 0 ? 'high' : 'middle');
  if (a === 0 && b === 0 && c === 0 && d === 0) return 'Centre: every factor in the middle';
  return `Sugar ${word(a)}, solids ${word(b)}, pectin ${word(c)}, lemon ${word(d)}`;
}

function at(day: string, hour: number): Date {
  return new Date(`${day}T${String(hour).padStart(2, '0')}:00:00Z`);
}

function daysBefore(day: string, days: number): Date {
  return new Date(at(day, 9).getTime() - days * 86_400_000);
}

export async function seedDemoModelHistory(em: EntityManager, developer: Actor): Promise<void> {
  const ws = developer.workspaceId;
  const ingredients = await em.find(Ingredient, { workspace: ws, typicalKey: { $in: ['apricot', 'sucrose', 'pectin_lm_amidated', 'calcium_citrate', 'lemon_juice'] } });
  const byKey = new Map(ingredients.map((i) => [i.typicalKey!, i]));
  const line = (key: string, grams: number): RevisionLine => {
    const row = byKey.get(key)!;
    return { ingredientId: row.id, ingredient: compositionOf(row, labelDataOf(row).nutrients), quantity: grams, unit: 'g' };
  };
  const base = await em.findOneOrFail(Formula, { workspace: ws, name: 'Apricot spread, reduced sugar' });
  const baseRevision = await em.findOneOrFail(FormulaRevision, { formula: base.id }, { orderBy: { number: 'asc' } });
  const attributes = await em.find(SensoryAttributeDef, { workspace: ws, libraryKey: { $in: ['set-firmness', 'tartness', 'overall-liking'] } });
  const attributeOf = (key: string) => attributes.find((a) => a.libraryKey === key)!.id;
  const rated = [
    { id: attributeOf('overall-liking'), truth: TRUTH.liking, spread: 1.1, round: (v: number) => Math.round(clamp(v, 1, 9)) },
    { id: attributeOf('set-firmness'), truth: TRUTH.firmness, spread: 1.0, round: (v: number) => Math.round(clamp(v, 0, 10) * 10) / 10 },
    { id: attributeOf('tartness'), truth: TRUTH.tartness, spread: 1.0, round: (v: number) => Math.round(clamp(v, 0, 10) * 10) / 10 },
  ];
  const last = await em.findOne(Trial, { workspace: ws }, { orderBy: { number: 'desc' } });
  let number = (last?.number ?? 0) + 1;
  let seed = 1;

  for (const history of HISTORY) {
    const created = daysBefore(history.cookDay, 6);
    const decided = daysBefore(history.panelDay, -3);
    const trial = em.create(Trial, {
      workspace: ws, number: number++, title: history.title, question: history.question, owner: developer.userId,
      baseFormula: base.id, baseRevision: baseRevision.number, status: 'decided', createdAt: created, updatedAt: decided,
    });
    const steps: Array<[null | 'planning' | 'cooking' | 'tasting', 'planning' | 'cooking' | 'tasting' | 'decided', Date, string | null]> = [
      [null, 'planning', created, null],
      ['planning', 'cooking', at(history.cookDay, 8), null],
      ['cooking', 'tasting', at(history.cookDay, 17), 'All cooked; panel booked'],
      ['tasting', 'decided', decided, 'Results go into the apricot spread model'],
    ];
    for (const [fromStatus, toStatus, changedAt, note] of steps) {
      em.create(TrialStatusChange, { workspace: ws, trial, fromStatus, toStatus, note, changedBy: developer.userId, changedAt });
    }

    const variants = history.runs.map((coded, position) => {
      const [a, b, c, d] = coded;
      const sugarRatio = level(LEVELS.sugarRatio, a);
      const pectin = level(LEVELS.pectinPerKgFruit, c);
      const lemon = level(LEVELS.lemonPerKgFruit, d);
      const settings = { ...baseRevision.settings, targetSolidsPct: level(LEVELS.targetSolidsPct, b), ruleDate: history.cookDay };
      const lines = [line('apricot', 1000), line('sucrose', sugarRatio * 1000), line('pectin_lm_amidated', pectin), line('calcium_citrate', 1), line('lemon_juice', lemon)];
      const outcome = computeFormula(settings, lines);
      if (!outcome.ok) throw new Error(`The model history's variant ${describe(coded)} does not compute: ${outcome.message}`);
      const computation = outcome.computation;
      const factorLevels: FactorLevel[] = [
        { factor: 'sugar_ratio', coded: a, value: sugarRatio },
        { factor: 'pectin_dose', coded: c, value: pectin },
        { factor: 'acid_dose', coded: d, value: lemon },
      ];
      const variant = em.create(Variant, {
        workspace: ws, trial, label: label(position), isBase: false, description: describe(coded), factorLevels, settings, lines,
        summary: {
          complianceOverall: computation.compliance.overall,
          dangerCount: computation.cautions.filter((x) => x.severity === 'danger').length,
          warningCount: computation.cautions.filter((x) => x.severity === 'warning').length,
          finishedMassG: computation.massBalance.finishedMassG,
        },
        position, createdBy: developer.userId, createdAt: created, updatedAt: created,
      });
      const s = seed++;
      const weeping = TRUTH.weeping(coded) + noise(s * 7 + 4) * 0.25;
      const finishedG = computation.massBalance.finishedMassG * (3000 / computation.massBalance.totalChargeG);
      em.create(Cook, {
        workspace: ws, variant, cookDate: history.cookDay, batchSizeG: 3000,
        brixReading: Math.round((settings.targetSolidsPct - 0.2 + noise(s * 7 + 1) * 0.5) * 10) / 10, brixSampleTempC: 20,
        ph: Math.round((TRUTH.ph(coded) + noise(s * 7 + 2) * 0.03) * 100) / 100,
        endPointTempC: Math.round((computation.endPoint.endPointC + noise(s * 7 + 3) * 0.4) * 10) / 10,
        boilTimeMin: Math.round(12 + b * 3 + noise(s * 7 + 5) * 2),
        setTestScore: Math.round(clamp(TRUTH.setTest(coded) + noise(s * 7 + 6) * 0.35, 1, 5)),
        setTestMethod: 'cold_plate',
        syneresis: weeping < 0.5 ? 'none' : weeping < 1.2 ? 'slight' : 'marked',
        colourNotes: null, yieldJars: Math.floor(finishedG / settings.jarNetFillG), yieldG: Math.round(finishedG), notes: null,
        recordedBy: developer.userId, createdAt: at(history.cookDay, 16),
      });
      return { variant, coded, seed: s };
    });

    // Two sittings of five samples, ten tasters each; every taster scores three attributes.
    for (let sitting = 0; sitting * SAMPLES_PER_SITTING < variants.length; sitting++) {
      const group = variants.slice(sitting * SAMPLES_PER_SITTING, (sitting + 1) * SAMPLES_PER_SITTING);
      const opened = at(history.panelDay, 10 + sitting * 3);
      const session = em.create(Tasting, {
        workspace: ws, trial, title: `Spread tasting, ${formatDate(history.panelDay)}, sitting ${sitting + 1}`,
        place: 'Tasting room', startsAt: opened, method: 'rated', state: 'closed', notice: NOTICE, attributeIds: rated.map((r) => r.id),
        rankingAttributeId: null, design: {}, joinCode: null, createdBy: developer.userId, createdAt: daysBefore(history.panelDay, 1),
        openedAt: opened, closedAt: new Date(opened.getTime() + 2 * 3_600_000),
      });
      // Three-digit codes, distinct within the sitting (a step of 173 never repeats within 900).
      const samples = group.map((g, i) => ({
        ...g,
        sample: em.create(TastingSample, {
          id: randomUUID(), workspace: ws, session, variant: g.variant, code: String(100 + ((number * 331 + sitting * 97 + i * 173) % 900)), position: i,
        }),
      }));
      session.design = { treatments: samples.map((s, i) => ({ letter: label(i), sampleId: s.sample.id })) };
      TASTERS.forEach((name, t) => {
        const order = samples.map((_, i) => samples[(i + t) % samples.length]);
        const seat = em.create(TastingSeat, {
          workspace: ws, session, seatIndex: t, kind: 'guest', user: null, displayName: name, tokenHash: hashSecret(newSecret()),
          servingOrder: order.map((s) => ({ code: s.sample.code!, sampleId: s.sample.id })), designRow: order.map((_, i) => label((i + t) % order.length)).join(''),
          consentedAt: opened, submittedAt: new Date(opened.getTime() + 3_600_000), lastSeenAt: null, createdAt: opened,
        });
        const bias = noise(1000 + t) * 0.5;
        for (const s of order) {
          for (const [k, attribute] of rated.entries()) {
            const key = randomUUID();
            em.create(TastingAnswer, {
              workspace: ws, session, seat, kind: 'rating', item: s.sample.code!, attribute: attribute.id, sampleId: s.sample.id,
              value: attribute.round(attribute.truth(s.coded) + bias + noise(s.seed * 131 + t * 17 + k * 5) * attribute.spread),
              ranking: null, oddCode: null, correct: null, confidence: null, comment: null, idempotencyKey: key, idempotencyKeys: [key],
              createdAt: opened, updatedAt: opened,
            });
          }
        }
      });
    }
  }
  await em.flush();
}
