import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ADMIN } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Audit log" };

export default async function AuditPage() {
  const { user, allowed } = await pageUser(ADMIN);
  if (!allowed) return <NotAllowed role={user.role} what="the audit log" />;
  return (
    <section>
      <h1 className="text-xl font-semibold">Audit log</h1>
    </section>
  );
}
