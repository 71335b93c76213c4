import 'server-only';
import bcrypt from 'bcryptjs';

const COST = 10;
// Compared against when the account does not exist, so a wrong e-mail costs as long as a wrong password.
const DUMMY_HASH = bcrypt.hashSync('candlewise-no-such-account', COST);

export function hashPassword(pw: string) {
  return bcrypt.hash(pw, COST);
}

export async function verifyPassword(pw: string, hash: string | null | undefined) {
  const ok = await bcrypt.compare(pw, hash ?? DUMMY_HASH);
  return ok && !!hash;
}
