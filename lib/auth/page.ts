// Gate for server-rendered pages: signed-out visitors go to the sign-in page;
// a signed-in user without the role gets { allowed: false } and the page shows
// the "not allowed" panel.
import { redirect } from "next/navigation";
import type { Role } from "@/db/schema";
import { sessionUser, type AuthUser } from "./guard";

export async function pageUser(roles: readonly Role[]): Promise<{ user: AuthUser; allowed: boolean }> {
  const user = await sessionUser();
  if (!user) redirect("/sign-in");
  return { user, allowed: roles.includes(user.role) };
}
