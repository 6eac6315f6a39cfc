import bcrypt from "bcryptjs";

// bcrypt cost 10: about 60 ms here, slow enough for guessing, quick enough for sign-in.
const COST = 10;

export const hashPassword = (plain: string): Promise<string> => bcrypt.hash(plain, COST);
export const verifyPassword = (plain: string, hash: string): Promise<boolean> => bcrypt.compare(plain, hash);
