import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ANY } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "API tokens" };

export default async function SettingsPage() {
  const { user, allowed } = await pageUser(ANY);
  if (!allowed) return <NotAllowed role={user.role} what="settings" />;
  return (
    <section>
      <h1 className="text-xl font-semibold">API tokens</h1>
    </section>
  );
}
