import { describe, expect, it } from 'vitest';
import {
  HEDONIC_9_POINT,
  JUST_ABOUT_RIGHT_5_POINT,
  SET_FIRMNESS_LINE,
  categoryLabel,
  isValidScaleValue,
  makeIntensityLine,
  snapLineValue,
} from '@/lib/sensory';

describe('9-point hedonic scale', () => {
  it('has exactly the published anchors from 9 down to 1', () => {
    // Source: Peryam & Pilgrim (1957), 9-point hedonic scale verbal anchors
    expect(HEDONIC_9_POINT.points).toEqual([
      { value: 9, label: 'Like extremely' },
      { value: 8, label: 'Like very much' },
      { value: 7, label: 'Like moderately' },
      { value: 6, label: 'Like slightly' },
      { value: 5, label: 'Neither like nor dislike' },
      { value: 4, label: 'Dislike slightly' },
      { value: 3, label: 'Dislike moderately' },
      { value: 2, label: 'Dislike very much' },
      { value: 1, label: 'Dislike extremely' },
    ]);
    expect(categoryLabel(HEDONIC_9_POINT, 5)).toBe('Neither like nor dislike');
  });

  it('accepts only the whole numbers 1 to 9', () => {
    // Source: Peryam & Pilgrim (1957) — nine categories scored 1 to 9
    for (let value = 1; value <= 9; value++) expect(isValidScaleValue(HEDONIC_9_POINT, value)).toBe(true);
    for (const value of [0, 10, 4.5, -1, Number.NaN, Number.POSITIVE_INFINITY, '7', null, undefined]) {
      expect(isValidScaleValue(HEDONIC_9_POINT, value)).toBe(false);
    }
  });

  it('cannot be altered at run time', () => {
    // Source: Peryam & Pilgrim (1957) — published anchors must stay verbatim
    expect(() => {
      (HEDONIC_9_POINT.points[0] as { label: string }).label = 'Love it';
    }).toThrow(TypeError);
    expect(HEDONIC_9_POINT.points[0].label).toBe('Like extremely');
  });
});

describe('5-point just-about-right scale', () => {
  it('runs Much too little … Much too much with 3 as just about right', () => {
    // Source: ASTM MNL 63, Just-About-Right (JAR) Scales (2009) — standard 5-point JAR wording (memory)
    const labelsLowToHigh = [...JUST_ABOUT_RIGHT_5_POINT.points]
      .sort((a, b) => a.value - b.value)
      .map((point) => `${point.value} ${point.label}`);
    expect(labelsLowToHigh).toEqual([
      '1 Much too little',
      '2 Somewhat too little',
      '3 Just about right',
      '4 Somewhat too much',
      '5 Much too much',
    ]);
    expect(JUST_ABOUT_RIGHT_5_POINT.justRightValue).toBe(3);
    expect(categoryLabel(JUST_ABOUT_RIGHT_5_POINT, JUST_ABOUT_RIGHT_5_POINT.justRightValue!)).toBe('Just about right');
  });

  it('accepts only 1 to 5', () => {
    // Source: ASTM MNL 63 (2009) — five labelled categories (memory)
    expect([0, 1, 2, 3, 4, 5, 6, 2.5].map((v) => isValidScaleValue(JUST_ABOUT_RIGHT_5_POINT, v))).toEqual([
      false, true, true, true, true, true, false, false,
    ]);
  });
});

describe('0–10 intensity line', () => {
  it('labels the set-firmness ends in our own words', () => {
    // Common practice, no published source: 0–10 line scale with worded end anchors
    expect(SET_FIRMNESS_LINE).toMatchObject({ minValue: 0, maxValue: 10, lowAnchor: 'Very loose', highAnchor: 'Very firm' });
  });

  it('accepts values on the 0.1 grid between 0 and 10', () => {
    // Common practice, no published source: line marks recorded to one decimal on a 0–10 line
    for (const value of [0, 0.1, 0.3, 5, 7.3, 9.9, 10]) expect(isValidScaleValue(SET_FIRMNESS_LINE, value), String(value)).toBe(true);
    expect(isValidScaleValue(SET_FIRMNESS_LINE, 0.1 + 0.2)).toBe(true); // float noise from slider arithmetic
    for (const value of [-0.1, 10.1, 7.35, Number.NaN, '5']) expect(isValidScaleValue(SET_FIRMNESS_LINE, value), String(value)).toBe(false);
  });

  it('snaps raw slider positions onto the grid and clamps them', () => {
    // Common practice, no published source: line marks recorded to one decimal on a 0–10 line
    expect(snapLineValue(SET_FIRMNESS_LINE, 7.349)).toBe(7.3);
    expect(snapLineValue(SET_FIRMNESS_LINE, 0.1 + 0.2)).toBe(0.3);
    expect(snapLineValue(SET_FIRMNESS_LINE, 12)).toBe(10);
    expect(snapLineValue(SET_FIRMNESS_LINE, -3)).toBe(0);
    expect(() => makeIntensityLine('x', 'X', '', 'High')).toThrow(/both ends/);
  });
});
