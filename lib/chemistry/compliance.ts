import { validateSettings } from './mass-balance';
import { EU_2024_AMENDMENT_FROM, OUT_OF_SCOPE, RULES, rulesInForce } from './rule-sets';
import type { ComplianceRule } from './rule-sets';
import type { MassBalance } from './mass-balance';
import { PRODUCT_CLASS_NAMES, type EuFruitGroup, type FormulaSettings } from './types';

export type RuleStatus = 'pass' | 'fail' | 'not_applicable' | 'not_evaluable';
export type OverallComplianceStatus = 'compliant' | 'non_compliant' | 'incomplete' | 'not_applicable';

/** The words screens and CSV exports use for each status. */
export const RULE_STATUS_LABELS: Record<RuleStatus, string> = {
  pass: 'Pass',
  fail: 'Fail',
  not_applicable: 'Not applicable',
  not_evaluable: 'Not evaluable',
};

export const OVERALL_STATUS_LABELS: Record<OverallComplianceStatus, string> = {
  compliant: 'Meets the rules checked',
  non_compliant: 'Does not meet the rules',
  incomplete: 'Incomplete: some rules could not be checked',
  not_applicable: 'No rule applies to this product class',
};

export interface RuleCheckResult {
  ruleId: string;
  title: string;
  requirement: string;
  /** Human-readable actual value; null when not applicable or not evaluable. */
  actual: string | null;
  actualValue: number | null;
  requiredValue: number | null;
  /** Null when the rule does not apply or cannot be evaluated. */
  passed: boolean | null;
  status: RuleStatus;
  source: string;
  note?: string;
}

export interface ComplianceReport {
  ruleSet: FormulaSettings['ruleSet'];
  ruleDate: string;
  productClass: FormulaSettings['productClass'];
  /** The edition of the rules that the date selects. */
  edition: string;
  overall: OverallComplianceStatus;
  results: RuleCheckResult[];
}

/** What the checks read from a batch: a mass balance (or the `massBalance` of a batch computation). */
export type ComplianceBatchInput = Pick<MassBalance, 'lines' | 'finishedMassG' | 'targetSolidsPct' | 'sweetenerSolidsG'>;

function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}

interface Evaluation {
  actualValue: number | null;
  requiredValue: number | null;
  note?: string;
}

/**
 * EU minimum for a fruit mix: each fruit's group minimum weighted by its share of the fruit.
 * Council Directive 2001/113/EC, Annex I, Part III: "Where fruits are mixed together, the minimum
 * contents laid down in part I for different kinds of fruit must be reduced in proportion to the
 * percentages used."
 * A fruit without a group key is treated as 'general', the strictest case.
 */
function evaluateEuFruit(rule: ComplianceRule, batch: ComplianceBatchInput): Evaluation {
  const isMarmalade = rule.productClasses.includes('marmalade');
  const fruitLines = batch.lines.filter((l) => l.ingredient.kind === 'fruit');
  if (isMarmalade) {
    const citrusG = fruitLines.filter((l) => l.ingredient.euFruitGroup === 'citrus').reduce((t, l) => t + l.massG, 0);
    return {
      actualValue: (citrusG / batch.finishedMassG) * 1000,
      requiredValue: rule.minimum ?? null,
      note: citrusG === 0 ? 'No fruit line is marked as citrus (euFruitGroup "citrus").' : undefined,
    };
  }
  const fruitG = fruitLines.reduce((t, l) => t + l.massG, 0);
  const byGroup = rule.minimumByEuGroup ?? {};
  const general = byGroup.general ?? 0;
  if (fruitG === 0) return { actualValue: 0, requiredValue: general, note: 'The formula has no fruit line.' };
  let weighted = 0;
  let unknownGroup = false;
  for (const line of fruitLines) {
    const group: EuFruitGroup = line.ingredient.euFruitGroup ?? 'general';
    if (!line.ingredient.euFruitGroup) unknownGroup = true;
    const min = byGroup[group] ?? general;
    weighted += (line.massG / fruitG) * min;
  }
  const notes: string[] = [];
  if (fruitLines.length > 1) notes.push('Minimum for a mixture weighted by each fruit\'s share (Directive 2001/113/EC, Annex I, Part III: minimums reduced in proportion to the percentages used).');
  if (unknownGroup) notes.push('A fruit without an EU group key was checked against the general minimum.');
  return {
    actualValue: (fruitG / batch.finishedMassG) * 1000,
    requiredValue: weighted,
    note: notes.length ? notes.join(' ') : undefined,
  };
}

function evaluateUsRatio(rule: ComplianceRule, batch: ComplianceBatchInput): Evaluation {
  const fruitLines = batch.lines.filter((l) => l.ingredient.kind === 'fruit');
  const fruitG = fruitLines.reduce((t, l) => t + l.massG, 0);
  if (batch.sweetenerSolidsG <= 0) {
    return { actualValue: null, requiredValue: null, note: 'No sweetener line, so the ratio cannot be formed.' };
  }
  const actualValue = (fruitG / batch.sweetenerSolidsG) * 55;
  if (rule.minimum !== undefined) return { actualValue, requiredValue: rule.minimum };
  const byGroup = rule.minimumByUsGroup ?? {};
  if (fruitG === 0) return { actualValue, requiredValue: null, note: 'The formula has no fruit line.' };
  let weighted = 0;
  for (const line of fruitLines) {
    const group = line.ingredient.usFruitGroup;
    const min = group ? byGroup[group] : undefined;
    if (min === undefined) {
      return { actualValue, requiredValue: null, note: `"${line.ingredient.name}" has no 21 CFR 150.160 fruit group, so the required ratio is unknown.` };
    }
    weighted += (line.massG / fruitG) * min;
  }
  const groups = new Set(fruitLines.map((l) => l.ingredient.usFruitGroup));
  const note = groups.size > 1
    // (memory) The mixed-group clause of 21 CFR 150.160(d)(1) was not read.
    ? 'Group I and Group II fruits mixed: the required parts are weighted by fruit mass.'
    : undefined;
  return { actualValue, requiredValue: weighted, note };
}

function evaluate(rule: ComplianceRule, batch: ComplianceBatchInput): Evaluation {
  switch (rule.metric) {
    case 'soluble_solids_pct':
      return { actualValue: batch.targetSolidsPct, requiredValue: rule.minimum ?? null, note: 'Planned value; confirm on the finished batch by refractometer.' };
    case 'fruit_per_1000g_finished':
      return evaluateEuFruit(rule, batch);
    case 'fruit_parts_per_55_sweetener':
      return evaluateUsRatio(rule, batch);
    default:
      return { actualValue: null, requiredValue: null };
  }
}

function joinNotes(...notes: (string | undefined)[]): string | undefined {
  const present = notes.filter((n): n is string => Boolean(n));
  return present.length ? present.join(' ') : undefined;
}

function requirementText(rule: ComplianceRule, requiredValue: number | null): string {
  if (requiredValue !== null) return `≥ ${round(requiredValue, 1)} ${rule.unit}`;
  const general = rule.minimumByEuGroup?.general;
  if (general !== undefined) return `≥ ${general} ${rule.unit} as a general rule; lower for the exception fruits`;
  const us = rule.minimumByUsGroup;
  if (us) return `≥ ${us['1']} (Group I) or ${us['2']} (Group II) ${rule.unit}`;
  return rule.minimum !== undefined ? `≥ ${rule.minimum} ${rule.unit}` : rule.title;
}

/** Which edition of the rules the date selects, for display beside the results. */
export function ruleEditionLabel(ruleSet: FormulaSettings['ruleSet'], isoDate: string): string {
  switch (ruleSet) {
    case 'eu':
      return isoDate.slice(0, 10) < EU_2024_AMENDMENT_FROM
        ? 'Council Directive 2001/113/EC (Annex I minimums before 14 June 2026)'
        : 'Council Directive 2001/113/EC as amended by Directive (EU) 2024/1438 (from 14 June 2026)';
    case 'us':
      return '21 CFR Part 150 (150.140 fruit jelly, 150.160 fruit preserves and jams)';
    default:
      return 'Codex Standard for Jams, Jellies and Marmalades (CXS 296-2009)';
  }
}

/**
 * Checks a batch against the rule set and date in `settings`. Every rule in force is reported;
 * one that does not cover the product class is returned as not applicable, not dropped.
 */
export function checkCompliance(batch: ComplianceBatchInput, settings: FormulaSettings): ComplianceReport {
  validateSettings(settings);
  const results: RuleCheckResult[] = [];
  for (const scope of OUT_OF_SCOPE) {
    if (scope.ruleSet === settings.ruleSet && scope.productClass === settings.productClass) {
      results.push({
        ruleId: `${scope.ruleSet}.scope.${scope.productClass}`,
        title: 'Scope of the standard',
        requirement: 'Product class within the scope of the standard',
        actual: null,
        actualValue: null,
        requiredValue: null,
        passed: null,
        status: 'not_applicable',
        source: scope.source,
        note: scope.reason,
      });
    }
  }
  for (const rule of rulesInForce(settings.ruleSet, settings.ruleDate)) {
    if (!rule.productClasses.includes(settings.productClass)) {
      results.push({
        ruleId: rule.id,
        title: rule.title,
        requirement: requirementText(rule, rule.minimum ?? null),
        actual: null,
        actualValue: null,
        requiredValue: null,
        passed: null,
        status: 'not_applicable',
        source: rule.source,
        note: `Applies to ${rule.productClasses.map((c) => PRODUCT_CLASS_NAMES[c]).join(', ')}, not to ${PRODUCT_CLASS_NAMES[settings.productClass]}.`,
      });
      continue;
    }
    const evaluation = evaluate(rule, batch);
    const evaluable = evaluation.actualValue !== null && evaluation.requiredValue !== null;
    // A hair of tolerance so 350.0000001 vs 350 float noise does not flip a result.
    const passed = evaluable ? (evaluation.actualValue as number) >= (evaluation.requiredValue as number) - 1e-9 : null;
    results.push({
      ruleId: rule.id,
      title: rule.title,
      requirement: requirementText(rule, evaluation.requiredValue),
      actual: evaluation.actualValue === null ? null : `${round(evaluation.actualValue, 1)} ${rule.unit}`,
      actualValue: evaluation.actualValue,
      requiredValue: evaluation.requiredValue,
      passed,
      status: passed === null ? 'not_evaluable' : passed ? 'pass' : 'fail',
      source: rule.source,
      note: joinNotes(evaluation.note, rule.note),
    });
  }
  return {
    ruleSet: settings.ruleSet,
    ruleDate: settings.ruleDate,
    productClass: settings.productClass,
    edition: ruleEditionLabel(settings.ruleSet, settings.ruleDate),
    overall: overallStatus(results),
    results,
  };
}

/** One verdict over rule results: any failure fails; anything not evaluable leaves it incomplete. */
export function overallStatus(results: readonly Pick<RuleCheckResult, 'status'>[]): OverallComplianceStatus {
  const applicable = results.filter((r) => r.status !== 'not_applicable');
  if (applicable.length === 0) return 'not_applicable';
  if (applicable.some((r) => r.status === 'fail')) return 'non_compliant';
  if (applicable.some((r) => r.status === 'not_evaluable')) return 'incomplete';
  return 'compliant';
}

export { RULES };
