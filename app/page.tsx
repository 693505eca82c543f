import { redirect } from "next/navigation";
import { connection } from "next/server";
import { homeFor } from "@/components/shell/nav-items";
import { sessionUser } from "@/lib/auth/guard";

export default async function Home() {
  await connection();
  const user = await sessionUser();
  redirect(user ? homeFor(user.role) : "/sign-in");
}
