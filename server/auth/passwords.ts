import { hash, verify } from '@node-rs/argon2';

// argon2id with OWASP Password Storage Cheat Sheet parameters (m = 19 MiB, t = 2, p = 1).
const options = { algorithm: 2 /* Argon2id in @node-rs/argon2's Algorithm enum */, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verifying against this keeps an unknown e-mail as slow as a wrong password.
let dummyHash: Promise<string> | null = null;
export async function burnVerifyTime(password: string): Promise<void> {
  dummyHash ??= hashPassword('spoolbook-timing-equaliser');
  await verifyPassword(await dummyHash, password);
}
