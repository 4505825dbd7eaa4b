import { hash, verify } from '@node-rs/argon2';

// argon2id with the library defaults (19 MiB memory, 2 iterations, 1 lane): OWASP's recommended minimum.
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

// A hash of a random string, used when the account does not exist so both paths cost the same time.
let decoyHash: Promise<string> | null = null;

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (passwordHash === null) {
    decoyHash ??= hash(`decoy-${Math.random()}`);
    await verify(await decoyHash, password).catch(() => false);
    return false;
  }
  return verify(passwordHash, password).catch(() => false);
}
