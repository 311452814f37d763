/** Every entity, listed explicitly: Turbopack minifies class names, so discovery by name is not an option. */
import { Workspace } from './Workspace';
import { User } from './User';
import { Membership } from './Membership';
import { Invitation } from './Invitation';
import { PasswordReset } from './PasswordReset';
import { ApiToken } from './ApiToken';
import { RateLimitBucket } from './RateLimitBucket';
import { Ingredient } from './Ingredient';
import { Formula } from './Formula';
import { FormulaRevision } from './FormulaRevision';
import { Trial } from './Trial';
import { TrialStatusChange } from './TrialStatusChange';
import { Variant } from './Variant';
import { Cook } from './Cook';
import { CookChange } from './CookChange';
import { Upload } from './Upload';
import { NotebookEntry } from './NotebookEntry';
import { NotebookConflict } from './NotebookConflict';
import { SensoryAttributeDef } from './SensoryAttributeDef';
import { Tasting } from './Tasting';
import { TastingSample } from './TastingSample';
import { TastingSeat } from './TastingSeat';
import { TastingAnswer } from './TastingAnswer';
import { Product } from './Product';
import { PromotionRequest } from './PromotionRequest';
import { ProductVersion } from './ProductVersion';
import { BatchRecord } from './BatchRecord';
import { AuditEvent } from './AuditEvent';
import { BatchDecision } from './BatchDecision';
import { CostSettings } from './CostSettings';
import { IngredientPrice } from './IngredientPrice';
import { PackagingItem } from './PackagingItem';
import { PackagingPrice } from './PackagingPrice';
import { PackFormat } from './PackFormat';
import { PackFormatItem } from './PackFormatItem';

export {
  Workspace, User, Membership, Invitation, PasswordReset, ApiToken, RateLimitBucket, Ingredient, Formula, FormulaRevision,
  Trial, TrialStatusChange, Variant, Cook, CookChange, Upload, NotebookEntry, NotebookConflict,
  SensoryAttributeDef, Tasting, TastingSample, TastingSeat, TastingAnswer,
  Product, PromotionRequest, ProductVersion, BatchRecord, BatchDecision, AuditEvent,
  CostSettings, IngredientPrice, PackagingItem, PackagingPrice, PackFormat, PackFormatItem,
};
export { ROLES } from './Membership';

export const allEntities = [
  Workspace, User, Membership, Invitation, PasswordReset, ApiToken, RateLimitBucket,
  Ingredient, Formula, FormulaRevision,
  Trial, TrialStatusChange, Variant, Cook, CookChange, Upload, NotebookEntry, NotebookConflict,
  SensoryAttributeDef, Tasting, TastingSample, TastingSeat, TastingAnswer,
  Product, PromotionRequest, ProductVersion, BatchRecord, BatchDecision, AuditEvent,
  CostSettings, IngredientPrice, PackagingItem, PackagingPrice, PackFormat, PackFormatItem,
];
