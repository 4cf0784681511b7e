import { Argon2id } from 'oslo/password';

// oslo's defaults (19 MiB, 2 iterations, parallelism 1) are OWASP's recommended Argon2id minimum.
const argon2id = new Argon2id();

export function hashPassword(password: string): Promise<string> {
  return argon2id.hash(password);
}

export function verifyPassword(hash: string, password: string): Promise<boolean> {
  return argon2id.verify(hash, password);
}
