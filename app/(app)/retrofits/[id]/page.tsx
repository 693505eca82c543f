import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { FieldHistory } from "@/components/field/field-history";
import { RetrofitWorkspace } from "@/components/retrofit/workspace";
import { RetrofitThreads } from "@/components/review/retrofit-threads";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { EDIT, READ_ALL } from "@/lib/auth/roles";
import { COMMENT_ROLES } from "@/lib/review/comments";
import { getRetrofitById } from "@/lib/retrofits/get";

export const metadata: Metadata = { title: "Retrofit" };

export default async function RetrofitPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUser(READ_ALL);
  if (!allowed) return <NotAllowed role={user.role} what="retrofits" />;
  const raw = (await params).id;
  if (!/^[1-9][0-9]{0,9}$/.test(raw)) notFound();
  const retrofit = await getRetrofitById({ id: Number(raw) });
  if (!retrofit) notFound();
  return (
    <div className="flex flex-col gap-8">
      <RetrofitWorkspace id={retrofit.id} canEdit={EDIT.includes(user.role)} />
      <RetrofitThreads retrofitId={retrofit.id} canComment={COMMENT_ROLES.includes(user.role)} />
      <FieldHistory retrofitId={retrofit.id} />
    </div>
  );
}
