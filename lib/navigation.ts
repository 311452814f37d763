/** The staff navigation. Each entry names the permission that shows it; later features add entries here. */
import { can, type Permission, type Role } from '@/lib/permissions';

export interface NavItem {
  href: string;
  label: string;
  permission: Permission;
  group: 'work' | 'settings';
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/home', label: 'Overview', permission: 'account.self', group: 'work' },
  { href: '/formulas', label: 'Formulas', permission: 'formulas.read', group: 'work' },
  { href: '/trials', label: 'Trials', permission: 'trials.read', group: 'work' },
  { href: '/tastings', label: 'Tastings', permission: 'tastings.read', group: 'work' },
  { href: '/models', label: 'Models', permission: 'models.read', group: 'work' },
  { href: '/ingredients', label: 'Ingredients', permission: 'ingredients.read', group: 'work' },
  { href: '/prices', label: 'Prices', permission: 'prices.read', group: 'work' },
  { href: '/production/reviews', label: 'Promotion reviews', permission: 'promotion.read', group: 'work' },
  { href: '/production', label: 'Production', permission: 'production.read', group: 'work' },
  { href: '/tastings/mine', label: 'My tastings', permission: 'tastings.own', group: 'work' },
  { href: '/settings/members', label: 'Members', permission: 'members.manage', group: 'settings' },
  { href: '/settings/attributes', label: 'Tasting attributes', permission: 'tastings.read', group: 'settings' },
  { href: '/settings/costs', label: 'Costs and currency', permission: 'costs.settings', group: 'settings' },
  { href: '/settings/tokens', label: 'API tokens', permission: 'tokens.manage', group: 'settings' },
  { href: '/settings/outbox', label: 'Mail outbox', permission: 'outbox.read', group: 'settings' },
  { href: '/settings/profile', label: 'Profile & units', permission: 'account.self', group: 'settings' },
];

/** mailOutbox: false hides the outbox, which exists only with the local mail fake (lib/outbox.ts). */
export function navFor(role: Role, { mailOutbox = true }: { mailOutbox?: boolean } = {}): NavItem[] {
  return NAV_ITEMS.filter((item) => can(role, item.permission) && (mailOutbox || item.href !== '/settings/outbox'));
}
