import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { openInvitation } from "@/lib/review/invitations";
import { SetPasswordForm } from "./set-password-form";

export const metadata: Metadata = { title: "Set your password" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  await connection();
  const { token } = await params;
  const invitation = /^[A-Za-z0-9_-]{20,200}$/.test(token) ? await openInvitation(token) : null;
  return (
    <main className="mx-auto mt-16 max-w-sm px-4">
      <h1 className="font-mono text-2xl font-semibold tracking-tight">clockgraft</h1>
      {invitation ? (
        <>
          <p className="mt-2 text-sm text-ink-soft">
            {invitation.name}, set a password for <span className="num">{invitation.email}</span> (
            {invitation.role}).
          </p>
          <SetPasswordForm token={token} email={invitation.email} />
        </>
      ) : (
        <div role="alert" className="panel mt-4">
          <p>This link is not valid any more: it was used, it expired, or it is incomplete.</p>
          <p className="mt-2 text-sm text-ink-soft">
            Ask an admin for a new invitation, or sign in if you already set a password.
          </p>
          <Link href="/sign-in" className="btn mt-3">
            Sign in
          </Link>
        </div>
      )}
    </main>
  );
}
