import { hash, verify } from "@node-rs/argon2";

// OWASP's argon2id minimum (19 MiB, 2 passes, 1 lane); Algorithm.Argon2id is the package default.
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

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

// A fixed hash to verify against when the account does not exist, so both cases take as long.
let dummyHash: Promise<string> | null = null;
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword("no-such-account-placeholder");
  return dummyHash;
}
