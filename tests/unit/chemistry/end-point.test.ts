import { describe, it, expect } from 'vitest';
import {
  ChemistryInputError, estimateEndPoint, standardAtmospherePressurePa, sucroseBoilingElevationC, syrupBoilingPointC,
  waterBoilingPointAtAltitudeC, waterBoilingPointAtPressureC,
} from '@/lib/chemistry';

describe('boiling point of water', () => {
  it('is 100 °C at one standard atmosphere', () => {
    // Source: definition of the standard atmosphere (101.325 kPa) and the boiling point of water
    expect(waterBoilingPointAtPressureC(101325)).toBeCloseTo(100, 1);
  });

  it('is about 96.7 °C at 1000 m', () => {
    // Source: International Standard Atmosphere with the Antoine equation for water (A 8.07131, B 1730.63, C 233.426, mmHg, 1–100 °C:
    // piping-designer.com "Antoine Constant"): 96.7 °C at 1000 m
    expect(standardAtmospherePressurePa(1000)).toBeCloseTo(89875, -1);
    expect(waterBoilingPointAtAltitudeC(1000)).toBeCloseTo(96.7, 1);
  });

  it('falls about 1 °C per 300 m', () => {
    // Source: McGee, On Food and Cooking (2004): subtract 2 °F / 1 °C for each 1000 ft / 305 m
    const drop = waterBoilingPointAtAltitudeC(0) - waterBoilingPointAtAltitudeC(305);
    expect(drop).toBeGreaterThan(0.9);
    expect(drop).toBeLessThan(1.2);
  });
});

describe('boiling points of sucrose solutions (measured table)', () => {
  it('gives 103.0 °C at 60 % and 103.9 °C at 65 % at sea level', () => {
    // Source: Lowe, Experimental Cookery (60 % sugar solution boils at 103.0 °C; 65 °Brix at 103.9 °C per Cruess & McNair)
    expect(syrupBoilingPointC(60, 100)).toBeCloseTo(103.0, 6);
    expect(syrupBoilingPointC(65, 100)).toBeCloseTo(103.9, 6);
  });

  it('gives 106.5 °C at 70 %', () => {
    // Source: Lowe, Experimental Cookery (a 70 per cent solution boils at 106.5 °C)
    expect(syrupBoilingPointC(70, 100)).toBeCloseTo(106.5, 6);
  });

  it('interpolates between table points and adds to the local water boiling point', () => {
    // Source: Lowe, Experimental Cookery (Cruess & McNair: add the elevation to the local boiling point of water)
    expect(sucroseBoilingElevationC(62.5)).toBeCloseTo((3.0 + 3.9) / 2, 6);
    expect(syrupBoilingPointC(65, 96.7)).toBeCloseTo(100.6, 6);
  });

  it('follows the Browne (1912) table at 10, 20, 40, 50 and 80 %', () => {
    // Source: Browne (1912) boiling-point elevations as tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1:
    // 10 % → 0.4 °C, 20 % → 0.6 °C, 40 % → 1.5 °C, 50 % → 2.0 °C, 70 % → 6.5 °C, 80 % → 12.0 °C
    const cases: [number, number][] = [[10, 0.4], [20, 0.6], [40, 1.5], [50, 2.0], [70, 6.5], [80, 12.0]];
    for (const [solidsPct, elevationC] of cases) {
      expect(sucroseBoilingElevationC(solidsPct)).toBeCloseTo(elevationC, 6);
    }
  });

  it('rejects solids outside the table', () => {
    expect(() => sucroseBoilingElevationC(95)).toThrow(ChemistryInputError);
  });
});

describe('setting point', () => {
  it('is water bp + 4 °C / 8 °F: 104 °C and 220 °F at sea level', () => {
    // Source: setting point rule "boiling point of water + about 4 °C (8 °F)", 220 °F / 104 °C at sea level (references: Lowe, Experimental Cookery, citing Cruess & McNair gives +3.9 °C)
    const estimate = estimateEndPoint({ targetSolidsPct: 65 });
    expect(estimate.waterBoilingBasis).toBe('sea_level');
    expect(estimate.ruleOfThumbEndPointC).toBeCloseTo(104, 1);
    expect(estimate.ruleOfThumbEndPointF).toBeCloseTo(220, 1);
  });

  it('uses the sucrose table inside its range and says so', () => {
    // Source: Lowe, Experimental Cookery (65 °Brix boils at 103.9 °C at sea level)
    const estimate = estimateEndPoint({ targetSolidsPct: 65 });
    expect(estimate.basis).toBe('sucrose_table');
    expect(estimate.endPointC).toBeCloseTo(103.9, 1);
  });

  it('prefers a measured water boiling point over altitude', () => {
    const estimate = estimateEndPoint({ targetSolidsPct: 60, altitudeM: 1000, measuredWaterBoilingC: 97.5 });
    expect(estimate.waterBoilingBasis).toBe('measured');
    // Source: Lowe, Experimental Cookery (60 % → +3.0 °C over water)
    expect(estimate.endPointC).toBeCloseTo(100.5, 6);
  });

  it('falls back to the rule of thumb outside the table', () => {
    const estimate = estimateEndPoint({ targetSolidsPct: 85, altitudeM: 1000 });
    expect(estimate.basis).toBe('rule_of_thumb');
    expect(estimate.endPointC).toBeCloseTo(waterBoilingPointAtAltitudeC(1000) + 4, 9);
  });
});
