"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { Role } from "@/db/schema";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

const ROLES: Role[] = ["admin", "engineer", "reviewer", "technician"];

type U = { id: number; name: string; email: string; role: Role; site: string | null; disabled: boolean };

/** One user's role, site and status, saved with PATCH /api/v1/users/:id. */
export function UserRow({ u, self }: { u: U; self: boolean }) {
  const router = useRouter();
  const [role, setRole] = useState(u.role);
  const [site, setSite] = useState(u.site ?? "");
  const [disabled, setDisabled] = useState(u.disabled);
  const [busy, setBusy] = useState(false);
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const dirty = role !== u.role || site !== (u.site ?? "") || disabled !== u.disabled;

  async function save() {
    setBusy(true);
    setMsg(null);
    try {
      await fetchJson(`/api/v1/users/${u.id}`, {
        method: "PATCH",
        body: JSON.stringify({ role, site, disabled }),
      });
      setMsg({ ok: true, text: "Saved." });
      router.refresh();
    } catch (err) {
      setMsg({ ok: false, text: err instanceof ClientApiError ? err.message : "Not saved. Try again." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <tr data-user={u.email}>
      <td>{u.name}</td>
      <td className="num">{u.email}</td>
      <td>
        <label className="sr-only" htmlFor={`role-${u.id}`}>
          Role of {u.name}
        </label>
        <select
          id={`role-${u.id}`}
          className="input"
          value={role}
          disabled={self}
          onChange={(e) => setRole(e.target.value as Role)}
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {r}
            </option>
          ))}
        </select>
      </td>
      <td>
        <label className="sr-only" htmlFor={`site-${u.id}`}>
          Site of {u.name} (empty = all sites)
        </label>
        <input
          id={`site-${u.id}`}
          className="input"
          value={site}
          placeholder="all sites"
          onChange={(e) => setSite(e.target.value)}
        />
      </td>
      <td>
        <label className="inline-flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={disabled}
            disabled={self}
            onChange={(e) => setDisabled(e.target.checked)}
          />
          Disabled
        </label>
      </td>
      <td className="whitespace-nowrap">
        <button type="button" className="btn" disabled={!dirty || busy} onClick={save}>
          {busy ? "Saving…" : "Save"}
        </button>
        {msg && (
          <span
            role={msg.ok ? "status" : "alert"}
            className={`ml-2 text-sm ${msg.ok ? "text-ok" : "text-hazard"}`}
          >
            {msg.text}
          </span>
        )}
      </td>
    </tr>
  );
}
