import bcrypt from "bcryptjs";

/** bcrypt work factor: 2^11 rounds, about 0.1 s per hash on the reference machine. */
const COST = 11;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

// A fixed hash to compare against when the account does not exist, so a missing
// account costs the same time as a wrong password and cannot be told apart.
let dummyHash: Promise<string> | undefined;

export async function verifyAgainstNothing(plain: string): Promise<false> {
  dummyHash ??= bcrypt.hash("no account has this password", COST);
  await bcrypt.compare(plain, await dummyHash);
  return false;
}
