import type { Metadata } from "next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

type Props = { searchParams: Promise<{ email?: string | string[]; welcome?: string | string[] }> };

/** A plain e-mail from the query (the invitation page sends the one it just set up); anything else is dropped. */
function emailFrom(raw: string | string[] | undefined): string {
  const v = Array.isArray(raw) ? raw[0] : raw;
  return v && v.length <= 254 && /^[^\s@]+@[^\s@]+$/.test(v) ? v : "";
}

export default async function SignInPage({ searchParams }: Props) {
  const q = await searchParams;
  const email = emailFrom(q.email);
  const welcome = q.welcome === "1" && email !== "";
  return (
    <main className="mx-auto mt-16 max-w-sm px-4">
      <h1 className="font-mono text-2xl font-semibold tracking-tight">clockgraft</h1>
      <p className="mt-1 text-sm text-ink-muted">Timing retrofits: old analog stages to exact timer code.</p>
      {welcome && (
        <p role="status" className="panel mt-6 text-sm" data-testid="invitation-accepted">
          {`Your account is set up. Sign in with ${email} and the password you just chose.`}
        </p>
      )}
      <SignInForm initialEmail={email} />
    </main>
  );
}
