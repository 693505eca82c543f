import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { FIELD_VIEW } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Field" };

export default async function FieldPage() {
  const { user, allowed } = await pageUser(FIELD_VIEW);
  if (!allowed) return <NotAllowed role={user.role} what="field work" />;
  return (
    <section>
      <h1 className="text-xl font-semibold">Field</h1>
    </section>
  );
}
