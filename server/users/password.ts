import bcrypt from 'bcryptjs';

const COST = 11;
/** A hash of a random string, compared against when the e-mail is unknown so both paths take as long. */
const DUMMY_HASH = bcrypt.hashSync('no-such-user-' + Math.random(), COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export async function verifyPassword(password: string, hash: string | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && hash !== undefined;
}
