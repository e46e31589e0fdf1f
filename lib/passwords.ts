import bcrypt from "bcryptjs";

const COST = Number(process.env.LW_BCRYPT_COST || 10);
export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const checkPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);
