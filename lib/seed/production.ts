/**
 * Demo production for Hollowmere Preserves, invented: the blackcurrant jam went through review
 * and is in production with a few batches (one failed and was reworked), and the reduced-sugar
 * apricot spread waits in the head of product's queue.
 */
import { recommendVariant } from '@/lib/results/mutations';
import { transitionTrial } from '@/lib/trials/mutations';
import { getPromotionDraft, getProductionVersion } from '@/lib/production/queries';
import { decideBatch, decidePromotion, recordBatch, requestPromotion, retestBatch } from '@/lib/production/mutations';
import { lotCodeFor } from '@/lib/production/vocabulary';
import type { Actor } from '@/lib/permissions';
import type { SeededTrial } from './trials';
import type { RecordedAt } from '@/lib/recorded-at';

async function request(developer: Actor, trial: SeededTrial, label: string, product: { name: string; code: string }, rationale: string, cookNotes: string, options: RecordedAt = {}) {
  const draft = await getPromotionDraft(developer, trial.trialId);
  const variant = draft.variants.find((v) => v.label === label)!;
  return requestPromotion(developer, {
    trialId: trial.trialId, variantId: variant.id, target: 'new_product', newProductName: product.name, newProductCode: product.code, rationale,
    process: { ...variant.defaults!.process, cookNotes }, spec: variant.defaults!.spec,
  }, options);
}

export async function seedDemoProduction(people: { developer: Actor; head: Actor; production: Actor }, trials: SeededTrial[]): Promise<void> {
  const [apricot, blackcurrant] = trials;
  const { developer, head, production } = people;

  const blackcurrantWhy = 'The base recipe set cleanly on the cold plate at every cook; less pectin softened it and more sugar added nothing the kitchen wanted.';
  // The story's days: cooked on 19 November (trials.ts), requested on the 23rd, approved on the 25th,
  // first production batch on the 27th.
  const day = (d: number, hour: number) => ({ at: new Date(Date.UTC(2026, 10, d, hour)) });
  await recommendVariant(developer, blackcurrant.trialId, { variantId: blackcurrant.variantIds.A, rationale: blackcurrantWhy }, day(23, 10));
  const approved = await request(developer, blackcurrant, 'A', { name: 'Blackcurrant jam', code: 'BCJ' }, blackcurrantWhy,
    'Bring the fruit to a rolling boil before the sugar goes in; skim once, just before filling.', day(23, 11));
  const { productVersionId } = await decidePromotion(head, approved.requestId, { decision: 'approve', comment: 'Set and solids held across three cooks. Approved for the 50 kg kettle.' }, day(25, 14));
  await transitionTrial(developer, blackcurrant.trialId, 'decided', 'Base recipe promoted to production', day(25, 15));

  const version = await getProductionVersion(production, productVersionId!);
  const s = version.spec;
  const midBrix = (s.solidsMinBrix + s.solidsMaxBrix) / 2;
  const midPh = (s.phMin + s.phMax) / 2;
  const batches = [
    { date: '2026-11-27', brix: midBrix + 0.3, temp: 19.5, ph: midPh - 0.05, fill: 88.5, mean: s.netFillG + 2.1, min: s.netFillG - 3, jars: 118, rejected: 1, notes: 'First production run on the 50 kg kettle.' },
    { date: '2026-11-28', brix: midBrix - 0.4, temp: 21, ph: midPh + 0.02, fill: 87.8, mean: s.netFillG + 1.4, min: s.netFillG - 4.5, jars: 120, rejected: 0, notes: null },
    // Acid short-weighed: pH above the window.
    { date: '2026-11-30', brix: midBrix, temp: 20, ph: s.phMax + 0.14, fill: 88.1, mean: s.netFillG + 1.8, min: s.netFillG - 2.5, jars: 117, rejected: 2, notes: 'Citric acid solution ran out half-way through dosing.',
      disposition: 'rework' as const, dispositionComment: 'Held for re-acidifying and a second boil.' },
    { date: '2026-12-01', brix: midBrix + 0.6, temp: 18.5, ph: midPh - 0.08, fill: 89.2, mean: s.netFillG + 2.6, min: s.netFillG - 2, jars: 119, rejected: 1, notes: 'Reworked lot from 30 November blended in.' },
    // Filled too cool after a burner fault: on hold until someone decides (the kitchen's worklist shows it).
    { date: '2026-12-02', brix: midBrix + 0.2, temp: 20, ph: midPh, fill: 82.5, mean: s.netFillG + 1.9, min: s.netFillG - 3, jars: 116, rejected: 0, notes: 'Burner tripped during filling; the last third went in cool.',
      disposition: 'hold' as const, dispositionComment: 'Held: jars filled below the hot-fill minimum. Decide whether to re-process or discard.' },
  ];
  const recorded: Array<{ batchId: string }> = [];
  // Each batch is recorded on its own day, after filling; the re-test and release on 1 December.
  const afterFilling = (date: string) => ({ at: new Date(`${date}T16:00:00Z`) });
  for (const b of batches) {
    recorded.push(await recordBatch(production, version.id, {
      lotCode: lotCodeFor(version.product.code, b.date, 1), batchDate: b.date, batchSizeG: 50_000,
      brixReading: Math.round(b.brix * 10) / 10, brixSampleTempC: b.temp, ph: Math.round(b.ph * 100) / 100, fillTempC: b.fill,
      netFillMeanG: Math.round(b.mean * 10) / 10, netFillMinG: Math.round(b.min * 10) / 10, setTestScore: 4, jarsFilled: b.jars, jarsRejected: b.rejected, notes: b.notes,
      disposition: 'disposition' in b ? b.disposition : null, dispositionComment: 'dispositionComment' in b ? b.dispositionComment : null,
    }, afterFilling(b.date)));
  }
  // The reworked lot: re-boiled and filled again, every reading taken afresh within the window, then released.
  await retestBatch(production, recorded[2].batchId, {
    brixReading: Math.round((midBrix + 0.1) * 10) / 10, brixSampleTempC: 20, ph: Math.round((midPh + 0.03) * 100) / 100, fillTempC: 88.4,
    netFillMeanG: Math.round((s.netFillG + 2) * 10) / 10, netFillMinG: Math.round((s.netFillG - 2.5) * 10) / 10, setTestScore: 4,
    comment: 'Re-acidified and re-boiled on 1 December, filled again; every reading taken afresh on cooled samples.',
  }, { at: new Date('2026-12-01T10:00:00Z') });
  await decideBatch(production, recorded[2].batchId, { decision: 'release', comment: 'Re-test within spec on every check.' }, { at: new Date('2026-12-01T11:00:00Z') });

  const apricotWhy = 'Variant E (more pectin at the higher sugar ratio) set firmest and scored best on overall liking; the panel did not find it too sweet.';
  await recommendVariant(developer, apricot.trialId, { variantId: apricot.variantIds.E, rationale: apricotWhy });
  await request(developer, apricot, 'E', { name: 'Apricot spread, reduced sugar', code: 'APS' }, apricotWhy,
    'LM pectin dispersed in a little of the sugar; keep the calcium solution measured per batch.');
}
