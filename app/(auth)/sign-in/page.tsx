import type { Metadata } from "next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <main className="mx-auto mt-16 max-w-sm px-4">
      <h1 className="font-mono text-2xl font-semibold tracking-tight">clockgraft</h1>
      <p className="mt-1 text-sm text-ink-muted">Timing retrofits: old analog stages to exact timer code.</p>
      <SignInForm />
    </main>
  );
}
