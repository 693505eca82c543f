// The field history of one retrofit, for engineers and reviewers as well as
// technicians (who see approved revisions of their site only).
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FieldHistory } from "@/components/field/field-history";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ANY } from "@/lib/auth/roles";
import { getRetrofit, technicianSeesRetrofit } from "@/lib/field/queries";

export const metadata: Metadata = { title: "Field history" };

export default async function RetrofitFieldPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUser(ANY);
  if (!allowed) return <NotAllowed role={user.role} what="field history" />;
  const raw = (await params).id;
  const id = /^[1-9][0-9]{0,9}$/.test(raw) ? Number(raw) : NaN;
  const retrofit = Number.isFinite(id) ? await getRetrofit({ id }) : null;
  if (!retrofit) notFound();
  if (user.role === "technician" && !(await technicianSeesRetrofit({ user, retrofitId: id }))) notFound();
  return (
    <div className="flex flex-col gap-4">
      <header>
        <Link href={user.role === "reviewer" ? `/retrofits/${id}` : "/field"} className="text-sm underline">
          ← Back
        </Link>
        <h1 className="text-xl font-semibold">
          <span className="num">{retrofit.assetTag}</span> · {retrofit.name}
        </h1>
        <p className="text-sm text-ink-soft">{retrofit.site}</p>
      </header>
      <FieldHistory retrofitId={id} />
    </div>
  );
}
