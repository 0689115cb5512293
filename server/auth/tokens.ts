import { createHash, randomBytes, randomUUID } from 'node:crypto';

/** A random single-use token for e-mailed links (256 bits) and the hash we store instead of it. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function newId(): string {
  return randomUUID();
}
