import { ChemistryInputError, requireFiniteNumber } from './errors';
import { celsiusToFahrenheit } from './units';

/** Sea-level standard pressure, Pa. */
export const STANDARD_PRESSURE_PA = 101325;
const PA_PER_MMHG = 101325 / 760;

/**
 * Antoine constants for water, log10(P / mmHg) = A − B / (C + T/°C), for 1–100 °C.
 * Source: piping-designer.com, "Antoine Constant" (water, 1 °C to 100 °C: A 8.07131, B 1730.63,
 * C 233.426, P in mmHg). At 760 mmHg they give 100.0 °C.
 */
export const WATER_ANTOINE = { a: 8.07131, b: 1730.63, c: 233.426 } as const;

/** International Standard Atmosphere (troposphere): p = p0 · (1 − 2.25577e-5 · h)^5.25588. */
export function standardAtmospherePressurePa(altitudeM: number): number {
  requireFiniteNumber(altitudeM, 'altitudeM');
  if (altitudeM < -500 || altitudeM > 11000) {
    throw new ChemistryInputError('altitudeM', 'altitude must be between -500 and 11000 m');
  }
  return STANDARD_PRESSURE_PA * Math.pow(1 - 2.25577e-5 * altitudeM, 5.25588);
}

/** Boiling point of pure water at a pressure, by inverting the Antoine equation. */
export function waterBoilingPointAtPressureC(pressurePa: number): number {
  requireFiniteNumber(pressurePa, 'pressurePa');
  if (pressurePa <= 0) throw new ChemistryInputError('pressurePa', 'pressure must be positive');
  const pressureMmHg = pressurePa / PA_PER_MMHG;
  return WATER_ANTOINE.b / (WATER_ANTOINE.a - Math.log10(pressureMmHg)) - WATER_ANTOINE.c;
}

export function waterBoilingPointAtAltitudeC(altitudeM: number): number {
  return waterBoilingPointAtPressureC(standardAtmospherePressurePa(altitudeM));
}

export type WaterBoilingBasis = 'measured' | 'altitude' | 'sea_level';

export interface WaterBoilingPoint {
  waterBoilingC: number;
  basis: WaterBoilingBasis;
}

/** A measured boiling point wins over altitude because it also captures the day's weather. */
export function resolveWaterBoilingPoint(options: { altitudeM?: number; measuredWaterBoilingC?: number }): WaterBoilingPoint {
  if (options.measuredWaterBoilingC !== undefined) {
    const measured = requireFiniteNumber(options.measuredWaterBoilingC, 'measuredWaterBoilingC');
    if (measured < 60 || measured > 105) {
      throw new ChemistryInputError('measuredWaterBoilingC', 'a measured water boiling point must be between 60 and 105 °C');
    }
    return { waterBoilingC: measured, basis: 'measured' };
  }
  if (options.altitudeM !== undefined) {
    return { waterBoilingC: waterBoilingPointAtAltitudeC(options.altitudeM), basis: 'altitude' };
  }
  return { waterBoilingC: waterBoilingPointAtPressureC(STANDARD_PRESSURE_PA), basis: 'sea_level' };
}

export interface SucroseBoilingPoint {
  solidsPct: number;
  boilingPointSeaLevelC: number;
  source: string;
}

/**
 * Measured boiling points of sucrose solutions at sea level. The measured values are used rather
 * than the ideal-solution (colligative) formula, which underestimates the rise by up to 3 °C at
 * jam strengths.
 * 60 % and 70 %: Lowe, Experimental Cookery (boiling points of sugar solutions, p. 49, from Browne).
 * 65 %: Cruess & McNair, quoted by Lowe ("65° Brix boils at sea level at 103.9 °C").
 * 10, 20, 40, 50 and 80 %: Browne (1912) as tabulated (cubic spline of Browne's points) in
 * vk1od.net, "Endpoint to boiling a sugar solution", Table 1 (0.4, 0.6, 1.5, 2.0 and 12.0 °C
 * elevation). The same table gives 70 % → 6.5 °C, as Lowe does. 30 % (1.0 °C) fell outside the
 * part of that table that was read (memory; its neighbour 32 % is 1.1 °C).
 * Note the 65 % point comes from a second author and makes the curve bend between 60 and 70 %
 * (the Browne spline gives 4.0 °C at 64 % and 4.8 °C at 66 %); we keep it because it is the
 * published jelly-strength value.
 */
export const SUCROSE_BOILING_TABLE: readonly SucroseBoilingPoint[] = [
  { solidsPct: 0, boilingPointSeaLevelC: 100.0, source: 'pure water' },
  { solidsPct: 10, boilingPointSeaLevelC: 100.4, source: 'Browne (1912), tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1' },
  { solidsPct: 20, boilingPointSeaLevelC: 100.6, source: 'Browne (1912), tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1' },
  { solidsPct: 30, boilingPointSeaLevelC: 101.0, source: 'Browne (1912), interpolated between neighbouring rows' }, // (memory) the 30 % row was not read; the 32 % row is +1.1 °C
  { solidsPct: 40, boilingPointSeaLevelC: 101.5, source: 'Browne (1912), tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1' },
  { solidsPct: 50, boilingPointSeaLevelC: 102.0, source: 'Browne (1912), tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1' },
  { solidsPct: 60, boilingPointSeaLevelC: 103.0, source: 'Lowe, Experimental Cookery' },
  { solidsPct: 65, boilingPointSeaLevelC: 103.9, source: 'Cruess & McNair, quoted in Lowe, Experimental Cookery' },
  { solidsPct: 70, boilingPointSeaLevelC: 106.5, source: 'Lowe, Experimental Cookery' },
  { solidsPct: 80, boilingPointSeaLevelC: 112.0, source: 'Browne (1912), tabulated in vk1od.net "Endpoint to boiling a sugar solution", Table 1' },
];

export const SUCROSE_TABLE_MAX_SOLIDS_PCT = SUCROSE_BOILING_TABLE[SUCROSE_BOILING_TABLE.length - 1].solidsPct;

/** Boiling-point elevation over water (°C) of a sucrose solution, interpolated linearly in the table. */
export function sucroseBoilingElevationC(solidsPct: number): number {
  requireFiniteNumber(solidsPct, 'solidsPct');
  if (solidsPct < 0 || solidsPct > SUCROSE_TABLE_MAX_SOLIDS_PCT) {
    throw new ChemistryInputError('solidsPct', `the sucrose boiling table covers 0–${SUCROSE_TABLE_MAX_SOLIDS_PCT} % solids`);
  }
  for (let i = 1; i < SUCROSE_BOILING_TABLE.length; i += 1) {
    const upper = SUCROSE_BOILING_TABLE[i];
    if (solidsPct <= upper.solidsPct) {
      const lower = SUCROSE_BOILING_TABLE[i - 1];
      const t = (solidsPct - lower.solidsPct) / (upper.solidsPct - lower.solidsPct);
      const boilingC = lower.boilingPointSeaLevelC + t * (upper.boilingPointSeaLevelC - lower.boilingPointSeaLevelC);
      return boilingC - 100;
    }
  }
  return SUCROSE_BOILING_TABLE[SUCROSE_BOILING_TABLE.length - 1].boilingPointSeaLevelC - 100;
}

/**
 * Boiling point of a sucrose syrup where water boils at `waterBoilingC`. Following Cruess & McNair,
 * the sea-level elevation is added to the local boiling point of water (an approximation: the
 * elevation shrinks slightly at lower pressure).
 */
export function syrupBoilingPointC(solidsPct: number, waterBoilingC: number): number {
  requireFiniteNumber(waterBoilingC, 'waterBoilingC');
  return waterBoilingC + sucroseBoilingElevationC(solidsPct);
}

/** Classic setting-point rule: water bp + about 4 °C (8 °F), i.e. 104 °C / 220 °F at sea level. */
export const RULE_OF_THUMB_ELEVATION_C = 4;
/** The rule's own Fahrenheit phrasing (8 °F, not 7.2 °F), so 212 °F water gives 220 °F. */
export const RULE_OF_THUMB_ELEVATION_F = 8;

export type EndPointBasis = 'sucrose_table' | 'rule_of_thumb';

export interface EndPointEstimate {
  waterBoilingC: number;
  waterBoilingBasis: WaterBoilingBasis;
  targetSolidsPct: number;
  /** The end point the module recommends, by `basis`. */
  endPointC: number;
  endPointF: number;
  basis: EndPointBasis;
  /** Null when the target is outside the sucrose table. */
  tableEndPointC: number | null;
  tableElevationC: number | null;
  ruleOfThumbEndPointC: number;
  ruleOfThumbEndPointF: number;
  note: string;
}

export function estimateEndPoint(options: {
  targetSolidsPct: number;
  altitudeM?: number;
  measuredWaterBoilingC?: number;
}): EndPointEstimate {
  const target = requireFiniteNumber(options.targetSolidsPct, 'targetSolidsPct');
  const water = resolveWaterBoilingPoint(options);
  const ruleOfThumbEndPointC = water.waterBoilingC + RULE_OF_THUMB_ELEVATION_C;
  const ruleOfThumbEndPointF = celsiusToFahrenheit(water.waterBoilingC) + RULE_OF_THUMB_ELEVATION_F;
  if (target >= 0 && target <= SUCROSE_TABLE_MAX_SOLIDS_PCT) {
    const tableElevationC = sucroseBoilingElevationC(target);
    const tableEndPointC = water.waterBoilingC + tableElevationC;
    return {
      waterBoilingC: water.waterBoilingC,
      waterBoilingBasis: water.basis,
      targetSolidsPct: target,
      endPointC: tableEndPointC,
      endPointF: celsiusToFahrenheit(tableEndPointC),
      basis: 'sucrose_table',
      tableEndPointC,
      tableElevationC,
      ruleOfThumbEndPointC,
      ruleOfThumbEndPointF,
      note: 'Water boiling point plus the measured elevation of a sucrose solution at the target solids. Fruit acids, invert sugar and other solids shift the real end point: confirm with a refractometer.',
    };
  }
  return {
    waterBoilingC: water.waterBoilingC,
    waterBoilingBasis: water.basis,
    targetSolidsPct: target,
    endPointC: ruleOfThumbEndPointC,
    endPointF: ruleOfThumbEndPointF,
    basis: 'rule_of_thumb',
    tableEndPointC: null,
    tableElevationC: null,
    ruleOfThumbEndPointC,
    ruleOfThumbEndPointF,
    note: `Target solids are outside the sucrose table (0–${SUCROSE_TABLE_MAX_SOLIDS_PCT} %), so the water bp + 4 °C rule is shown. Confirm with a refractometer.`,
  };
}
