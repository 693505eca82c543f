"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

/** Invite by e-mail: the person gets a one-time link to set a password. */
export function InviteForm() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; fields?: Record<string, string> } | null>(null);
  const [link, setLink] = useState<string | null>(null);

  async function send(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = Object.fromEntries(new FormData(form)) as Record<string, string>;
    setBusy(true);
    setError(null);
    setLink(null);
    try {
      const res = await fetchJson<{ link: string }>("/api/v1/invitations", {
        method: "POST",
        body: JSON.stringify(data),
      });
      setLink(res.link);
      form.reset();
      router.refresh();
    } catch (err) {
      setError(
        err instanceof ClientApiError
          ? { message: err.message, fields: err.fields }
          : { message: "Not sent. Try again." },
      );
    } finally {
      setBusy(false);
    }
  }

  const fieldError = (name: string) =>
    error?.fields?.[name] ? (
      <p className="field-error" id={`inv-${name}-err`}>
        {error.fields[name]}
      </p>
    ) : null;

  return (
    <form
      onSubmit={send}
      className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5 lg:items-end"
      aria-label="Invite a user"
    >
      <div>
        <label htmlFor="inv-email" className="field-label">
          E-mail
        </label>
        <input id="inv-email" name="email" type="email" required className="input" />
        {fieldError("email")}
      </div>
      <div>
        <label htmlFor="inv-name" className="field-label">
          Name
        </label>
        <input id="inv-name" name="name" required className="input" />
        {fieldError("name")}
      </div>
      <div>
        <label htmlFor="inv-role" className="field-label">
          Role
        </label>
        <select id="inv-role" name="role" className="input" defaultValue="technician">
          <option value="technician">technician</option>
          <option value="engineer">engineer</option>
          <option value="reviewer">reviewer</option>
          <option value="admin">admin</option>
        </select>
      </div>
      <div>
        <label htmlFor="inv-site" className="field-label">
          Site (empty = all sites)
        </label>
        <input id="inv-site" name="site" className="input" />
      </div>
      <div>
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? "Sending…" : "Send invitation"}
        </button>
      </div>
      {error && (
        <p role="alert" className="field-error sm:col-span-2 lg:col-span-5">
          {error.message}
        </p>
      )}
      {link && (
        <p role="status" className="text-sm sm:col-span-2 lg:col-span-5">
          Invitation sent. The one-time link (shown once, valid 7 days):{" "}
          <span className="num break-all">{link}</span>
        </p>
      )}
    </form>
  );
}
