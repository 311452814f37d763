import 'server-only';
import bcrypt from 'bcryptjs';

const BCRYPT_COST = 11;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a fixed hash when the user has none, so timing does not reveal which e-mails exist.
  return bcrypt.compare(password, hash ?? '$2b$11$C6UzMDM.H6dfI/f/IKcEeO5Bg5S7RVtGc3ZaJ6XoG6l8mS1xwQ6nW');
}
