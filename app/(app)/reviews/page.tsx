import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { REVIEW_VIEW } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Reviews" };

export default async function ReviewsPage() {
  const { user, allowed } = await pageUser(REVIEW_VIEW);
  if (!allowed) return <NotAllowed role={user.role} what="the review queue" />;
  return (
    <section>
      <h1 className="text-xl font-semibold">Reviews</h1>
    </section>
  );
}
