import bcrypt from "bcryptjs";

const COST = Number(process.env.LW_BCRYPT_COST || 10);
export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const checkPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);

/** A real comparison against a hash of nothing anyone can type (made once), for sign-ins to unknown addresses: always false. */
let nothing: Promise<string> | null = null;
export async function checkAgainstNothing(plain: string): Promise<false> {
  nothing ??= bcrypt.hash(`no account ${Math.random()}`, COST);
  await bcrypt.compare(plain, await nothing);
  return false;
}
