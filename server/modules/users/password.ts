import bcrypt from 'bcryptjs';

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A hash to compare against when the e-mail is unknown, so timing does not reveal accounts. */
export const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', COST);
