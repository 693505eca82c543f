import type { Metadata } from "next";
import Link from "next/link";
import { RetrofitsTable } from "@/components/retrofit/retrofits-table";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { EDIT, READ_ALL } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Retrofits" };

export default async function RetrofitsPage() {
  const { user, allowed } = await pageUser(READ_ALL);
  if (!allowed) return <NotAllowed role={user.role} what="the retrofits list" />;
  const canEdit = EDIT.includes(user.role);
  return (
    <section className="space-y-4">
      <div className="flex items-center justify-between gap-3">
        <h1 className="text-xl font-semibold">Retrofits</h1>
        {canEdit && (
          <Link href="/retrofits/new" className="btn-primary">
            New retrofit
          </Link>
        )}
      </div>
      <RetrofitsTable canEdit={canEdit} />
    </section>
  );
}
