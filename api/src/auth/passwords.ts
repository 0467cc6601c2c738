import bcrypt from 'bcryptjs';

/** bcrypt work factor: about 100 ms per hash on a current server core (OWASP's floor is 10). */
export const BCRYPT_ROUNDS = 11;

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);

// Compared against when an e-mail has no account, so a wrong e-mail takes as long as a wrong password.
const UNKNOWN_ACCOUNT_HASH = bcrypt.hashSync('no account has this password', BCRYPT_ROUNDS);

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const matches = await bcrypt.compare(password, hash ?? UNKNOWN_ACCOUNT_HASH);
  return matches && Boolean(hash);
}
