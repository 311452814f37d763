/** Public API of the pure batch-chemistry module. */
export * from './types';
export { ChemistryInputError, plainChemistryMessage } from './errors';
export * from './units';
export * from './mass-balance';
export * from './end-point';
export * from './water-activity';
export * from './refractometer';
export * from './scaling';
export * from './rule-sets';
export {
  checkCompliance,
  overallStatus,
  OVERALL_STATUS_LABELS,
  RULE_STATUS_LABELS,
  ruleEditionLabel,
  type ComplianceBatchInput,
  type ComplianceReport,
  type OverallComplianceStatus,
  type RuleCheckResult,
  type RuleStatus,
} from './compliance';
export * from './guidance';
export * from './batch';
export * from './typical-ingredients';
export * from './qc';
