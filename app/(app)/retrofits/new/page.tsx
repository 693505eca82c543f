import type { Metadata } from "next";
import { NewRetrofit } from "@/components/retrofit/new-retrofit";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { EDIT } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "New retrofit" };

export default async function NewRetrofitPage() {
  const { user, allowed } = await pageUser(EDIT);
  if (!allowed) return <NotAllowed role={user.role} what="creating retrofits" />;
  return (
    <section className="mx-auto max-w-3xl space-y-4">
      <h1 className="text-xl font-semibold">New retrofit</h1>
      <p className="text-sm text-ink-soft">
        The asset first; the old stage and the targets come on the next page.
      </p>
      <div className="panel">
        <NewRetrofit />
      </div>
    </section>
  );
}
