import { describe, expect, it } from 'vitest';
import {
  DEFAULT_ATTRIBUTE_LIBRARY,
  HEDONIC_9_POINT,
  createDefaultAttributeLibrary,
  defaultAttributeById,
  isValidScaleValue,
} from '@/lib/sensory';

describe('default attribute library', () => {
  it('holds the six starting attributes with their scale types', () => {
    // Common practice, no published source: texture, taste, flavour and liking attributes for fruit spreads
    const summary = DEFAULT_ATTRIBUTE_LIBRARY.map((a) => `${a.id}:${a.scale.kind}:${a.scale.purpose}`);
    expect(summary).toEqual([
      'set-firmness:line:intensity',
      'spreadability:line:intensity',
      'tartness:line:intensity',
      'sweetness:category:just-about-right',
      'fruit-flavour:line:intensity',
      'overall-liking:category:liking',
    ]);
  });

  it('scores overall liking on the Peryam & Pilgrim hedonic scale', () => {
    // Source: Peryam & Pilgrim (1957), 9-point hedonic scale
    const liking = defaultAttributeById('overall-liking');
    expect(liking?.scale).toBe(HEDONIC_9_POINT);
    expect(liking && isValidScaleValue(liking.scale, 9)).toBe(true);
  });

  it('gives every attribute an instruction and worded ends', () => {
    // Common practice, no published source: each attribute carries a taster instruction
    for (const attribute of DEFAULT_ATTRIBUTE_LIBRARY) {
      expect(attribute.tasterInstruction.length, attribute.id).toBeGreaterThan(40);
      if (attribute.scale.kind === 'line') {
        expect(attribute.scale.lowAnchor).not.toBe(attribute.scale.highAnchor);
      }
    }
    expect(new Set(DEFAULT_ATTRIBUTE_LIBRARY.map((a) => a.id)).size).toBe(DEFAULT_ATTRIBUTE_LIBRARY.length);
  });

  it('warns that lowering sugar or changing acid is a food-safety matter', () => {
    // Source: 21 CFR 114.3 — acid foods have equilibrium pH ≤ 4.6
    const sweetness = defaultAttributeById('sweetness');
    const tartness = defaultAttributeById('tartness');
    for (const caution of [sweetness?.formulationCaution, tartness?.formulationCaution]) {
      expect(caution).toMatch(/4\.6/);
      expect(caution).toMatch(/local food-safety codes and licensed practice govern/i);
    }
    expect(sweetness?.formulationCaution).toMatch(/water activity/);
  });

  it('returns a fresh, editable copy for each new workspace', () => {
    // Common practice, no published source: a workspace edits its own library
    const first = createDefaultAttributeLibrary();
    const second = createDefaultAttributeLibrary();
    first[0].tasterInstruction = 'Edited by this workspace.';
    expect(second[0].tasterInstruction).not.toBe('Edited by this workspace.');
    expect(defaultAttributeById('set-firmness')?.tasterInstruction).not.toBe('Edited by this workspace.');
    expect(defaultAttributeById('no-such-attribute')).toBeUndefined();
  });
});
