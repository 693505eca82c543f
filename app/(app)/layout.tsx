import { redirect } from "next/navigation";
import { connection } from "next/server";
import { AppHeader } from "@/components/shell/app-header";
import { Providers } from "@/components/shell/providers";
import { sessionUser } from "@/lib/auth/guard";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  await connection();
  const user = await sessionUser();
  if (!user) redirect("/sign-in");
  return (
    <Providers>
      <AppHeader user={user} />
      <main className="mx-auto max-w-7xl px-4 py-6">{children}</main>
    </Providers>
  );
}
