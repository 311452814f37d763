/** The five roles a membership can hold. Pure data, safe to import from client components. */
export const ROLES = ['admin', 'developer', 'head_of_product', 'production', 'taster'] as const;
export type Role = (typeof ROLES)[number];
