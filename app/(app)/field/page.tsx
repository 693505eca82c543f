import type { Metadata } from "next";
import { BundleList } from "@/components/field/bundle-list";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { FIELD_VIEW } from "@/lib/auth/roles";
import { listFieldAssets } from "@/lib/field/queries";

export const metadata: Metadata = { title: "Field" };

export default async function FieldPage() {
  const { user, allowed } = await pageUser(FIELD_VIEW);
  if (!allowed) return <NotAllowed role={user.role} what="field work" />;
  const assets = await listFieldAssets({ user });
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold">Field</h1>
        <p className="text-sm text-ink-soft">
          Released bundles{user.role === "technician" && user.site ? ` for ${user.site}` : ""}, by site and
          asset. Compare the sha256 of the downloaded zip with the one shown before flashing.
        </p>
      </div>
      <BundleList assets={assets} />
    </section>
  );
}
