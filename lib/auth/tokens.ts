// Personal API tokens: "cgt_" + 32 random bytes (base64url). Only the sha256 is
// stored; the secret is shown once when it is made.
import { createHash, randomBytes } from "node:crypto";

export const TOKEN_PREFIX = "cgt_";

export function newTokenSecret(): { secret: string; hash: string; prefix: string } {
  const secret = TOKEN_PREFIX + randomBytes(32).toString("base64url");
  return { secret, hash: hashToken(secret), prefix: secret.slice(0, 10) };
}

export const hashToken = (secret: string) => createHash("sha256").update(secret).digest("hex");
