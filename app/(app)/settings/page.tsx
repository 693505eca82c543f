import type { Metadata } from "next";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ANY } from "@/lib/auth/roles";
import { TokensPanel } from "./tokens-panel";

export const metadata: Metadata = { title: "API tokens" };

export default async function SettingsPage() {
  const { user, allowed } = await pageUser(ANY);
  if (!allowed) return <NotAllowed role={user.role} what="settings" />;
  return (
    <section className="mx-auto max-w-3xl space-y-4">
      <h1 className="text-xl font-semibold">API tokens</h1>
      <p className="text-sm text-ink-soft">
        Personal tokens let your own scripts call <code>/api/v1/</code> as you, with your role: send{" "}
        <code>Authorization: Bearer &lt;token&gt;</code>. A token is shown once when made; only its hash is
        kept.
      </p>
      <TokensPanel />
    </section>
  );
}
