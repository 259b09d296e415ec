import argon2 from 'argon2';

// argon2id with the library's defaults (64 MiB, t=3), per the OWASP password storage cheat sheet.
export function hashPassword(plain: string): Promise<string> {
  return argon2.hash(plain, { type: argon2.argon2id });
}

export function verifyPassword(hash: string, plain: string): Promise<boolean> {
  return argon2.verify(hash, plain).catch(() => false);
}

// Verifying against a real hash when the e-mail is unknown makes both failures take as long.
let unknownUserHash: Promise<string> | undefined;

export async function burnVerification(plain: string): Promise<false> {
  unknownUserHash ??= hashPassword('no account has this password');
  await verifyPassword(await unknownUserHash, plain);
  return false;
}
