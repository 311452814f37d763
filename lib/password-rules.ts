/** Shown beside every password field; lib/passwords.ts enforces the same rules. */
export const PASSWORD_RULES = 'At least 10 characters, with at least one letter and one digit or symbol.';
