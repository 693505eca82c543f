import bcrypt from "bcryptjs";

const COST = 10;
// Compared against when the e-mail is unknown, so a missing account takes as
// long to refuse as a wrong password (no timing oracle).
const DUMMY_HASH = "$2b$10$CwTycUXWue0Thq9StjUM0uJ8.fuZ5O9HhQdGu9ZkzKqz4N0gJ4G5m";

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);

export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  const ok = await bcrypt.compare(plain, hash ?? DUMMY_HASH);
  return ok && !!hash;
}
