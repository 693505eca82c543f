import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { READ_ALL } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Retrofits" };

export default async function RetrofitsPage() {
  const { user, allowed } = await pageUser(READ_ALL);
  if (!allowed) return <NotAllowed role={user.role} what="the retrofits list" />;
  return (
    <section>
      <h1 className="text-xl font-semibold">Retrofits</h1>
    </section>
  );
}
