/**
 * Notebook entries and photos for the demo trials. Text and pictures are invented here;
 * the pictures are drawn by makeDemoPhoto, never taken from anywhere.
 */
import { saveEntry } from '@/lib/notebook/mutations';
import type { TiptapNode } from '@/lib/notebook/shape';
import { createUpload } from '@/lib/uploads/mutations';
import type { Actor } from '@/lib/permissions';
import { makeDemoPhoto } from './photos';
import type { SeededTrial } from './trials';

type Node = TiptapNode;
const text = (t: string, marks?: string[]): Node => ({ type: 'text', text: t, ...(marks ? { marks: marks.map((m) => ({ type: m })) } : {}) });
const p = (...content: Node[]): Node => ({ type: 'paragraph', content });
const h = (level: number, t: string): Node => ({ type: 'heading', attrs: { level }, content: [text(t)] });
const bullets = (...items: string[]): Node => ({ type: 'bulletList', content: items.map((i) => ({ type: 'listItem', content: [p(text(i))] })) });
const checks = (...items: Array<[string, boolean]>): Node => ({
  type: 'taskList',
  content: items.map(([t, checked]) => ({ type: 'taskItem', attrs: { checked }, content: [p(text(t))] })),
});
const image = (src: string, alt: string): Node => ({ type: 'image', attrs: { src, alt } });

async function photo(actor: Actor, trialId: string, variantId: string | null, label: string, hue: number, subject: 'jar' | 'set_test' | 'spread') {
  const bytes = await makeDemoPhoto(label, hue);
  return createUpload(actor, { trialId, variantId, subject, file: { name: `${label.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.jpg`, bytes } });
}

export async function seedDemoNotebooks(developer: Actor, trials: SeededTrial[]): Promise<void> {
  const [apricot, blackcurrant] = trials;

  const jars = await photo(developer, apricot.trialId, null, 'Apricot A to E', 32, 'jar');
  const setB = await photo(developer, apricot.trialId, apricot.variantIds.B, 'Variant B set test', 28, 'set_test');
  await photo(developer, apricot.trialId, apricot.variantIds.E, 'Variant E on toast', 36, 'spread');

  await saveEntry(developer, {
    trialId: apricot.trialId,
    variantId: null,
    baseVersion: 0,
    doc: {
      type: 'doc',
      content: [
        h(2, 'Plan'),
        p(text('Four corners of sugar ratio (0.35 / 0.50 g per g fruit) against LM pectin (8 / 12 g per kg fruit), all from one 12 kg lot of apricots, cooked the same morning in the 5 kg pan.')),
        checks(['Weigh the fruit lot and take its Brix', true], ['Calibrate the pH meter at 4.01 and 7.00', true], ['Cook A to E, 3 kg charge each', true], ['Book the panel room', false]),
        h(2, 'At the stove'),
        p(text('B (low sugar, low pectin) stayed runny on the cold plate; E set firmly. All five read pH 3.6–3.7, inside our working limit but above the 3.5 HM window, which does not matter for LM pectin. '), text('Reduced-sugar: refrigerate after opening.', ['bold'])),
        image(jars.url, 'The five variants in jars, A to E'),
        bullets('Boil times 12–18 minutes', 'Slight weeping on B after 24 h', 'Colour darkest on C'),
      ],
    },
  });
  await saveEntry(developer, {
    trialId: apricot.trialId,
    variantId: apricot.variantIds.B,
    baseVersion: 0,
    doc: { type: 'doc', content: [p(text('Loose set: the drop ran back on the plate after a minute. Probably needs the higher pectin dose at this sugar level.')), image(setB.url, 'Cold-plate set test of variant B')] },
  });
  await saveEntry(developer, {
    trialId: blackcurrant.trialId,
    variantId: null,
    baseVersion: 0,
    doc: {
      type: 'doc',
      content: [
        h(2, 'Why'),
        p(text('Blackcurrants are high in pectin, so the added pectin may be doing little. If B sets like A we can drop it and save a step.')),
        p(text('D and E (sugar ratio) are still to cook.', ['italic'])),
      ],
    },
  });
}
