import { db } from "@/db/client";
import { apiTokens, users } from "@/db/schema";
import { newTokenSecret } from "@/lib/auth/tokens";
import { eq } from "drizzle-orm";
const [u] = await db.select().from(users).where(eq(users.name, "Benchmark"));
const t = newTokenSecret();
await db.insert(apiTokens).values({ userId: u.id, name: "probe", tokenHash: t.hash, prefix: t.prefix });
console.log(t.secret);
process.exit(0);
