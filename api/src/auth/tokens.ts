import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

/** A URL-safe random secret with 256 bits of entropy, for cookies and links in mails. */
export function newSecret(): string {
  return randomBytes(32).toString('base64url');
}

/** What is stored instead of a secret: a fast hash is enough because the secret itself is random. */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}

export function sameSecret(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}
