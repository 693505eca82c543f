"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

const MIN = 10;

export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [password, setPassword] = useState("");
  const [again, setAgain] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function send(e: React.FormEvent) {
    e.preventDefault();
    if (password.length < MIN) return setError(`Use at least ${MIN} characters.`);
    if (password !== again) return setError("The two passwords differ.");
    setBusy(true);
    setError(null);
    try {
      await fetchJson("/api/v1/invitations/accept", {
        method: "POST",
        body: JSON.stringify({ token, password }),
      });
      router.push(`/sign-in?email=${encodeURIComponent(email)}&welcome=1`);
    } catch (err) {
      setError(
        err instanceof ClientApiError ? err.message : "Not saved. Check the connection and try again.",
      );
      setBusy(false);
    }
  }

  return (
    <form onSubmit={send} className="mt-4 space-y-3" aria-label="Set your password">
      <div>
        <label htmlFor="pw" className="field-label">
          New password (at least {MIN} characters)
        </label>
        <input
          id="pw"
          type="password"
          autoComplete="new-password"
          className="input"
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          required
        />
      </div>
      <div>
        <label htmlFor="pw2" className="field-label">
          Repeat the password
        </label>
        <input
          id="pw2"
          type="password"
          autoComplete="new-password"
          className="input"
          value={again}
          onChange={(e) => setAgain(e.target.value)}
          required
        />
      </div>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary w-full justify-center" disabled={busy}>
        {busy ? "Saving…" : "Set password"}
      </button>
    </form>
  );
}
