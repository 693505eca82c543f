"use client";
// Make (secret shown once), list and revoke personal API tokens.
import { useState } from "react";
import { useForm } from "react-hook-form";
import useSWR from "swr";
import { ClientApiError, fetchJson } from "@/lib/client/fetch-json";

type TokenRow = {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
};

const day = (s: string | null) => (s ? s.slice(0, 16).replace("T", " ") : "—");

export function TokensPanel() {
  const { data, error, mutate } = useSWR<{ tokens: TokenRow[] }>("/api/v1/tokens");
  const [secret, setSecret] = useState<{ name: string; secret: string } | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<{ name: string }>({ defaultValues: { name: "" } });

  const create = handleSubmit(async (values) => {
    setActionError(null);
    try {
      const res = await fetchJson<{ token: { name: string; secret: string } }>("/api/v1/tokens", {
        method: "POST",
        body: JSON.stringify(values),
      });
      setSecret({ name: res.token.name, secret: res.token.secret });
      reset();
      await mutate();
    } catch (e) {
      if (e instanceof ClientApiError && e.fields?.name) setError("name", { message: e.fields.name });
      else setActionError(e instanceof Error ? e.message : String(e));
    }
  });

  async function revoke(t: TokenRow) {
    if (!window.confirm(`Revoke "${t.name}"? Scripts using it stop working at once.`)) return;
    setActionError(null);
    try {
      await fetchJson(`/api/v1/tokens/${t.id}`, { method: "DELETE" });
      await mutate();
    } catch (e) {
      setActionError(e instanceof Error ? e.message : String(e));
    }
  }

  return (
    <div className="space-y-4">
      <form
        onSubmit={create}
        noValidate
        className="panel flex flex-wrap items-end gap-3"
        aria-label="New token"
      >
        <div className="min-w-[16rem] flex-1">
          <label className="field-label" htmlFor="token-name">
            Token name
          </label>
          <input
            id="token-name"
            className="input"
            placeholder="e.g. nightly bundle fetch"
            aria-invalid={Boolean(errors.name)}
            aria-describedby={errors.name ? "token-name-error" : undefined}
            {...register("name", {
              // The same rule and messages as tokenBodySchema, which the API
              // applies; kept inline so this page does not ship zod.
              validate: (v) => {
                const name = v.trim();
                if (!name) return "Name the token.";
                return name.length <= 60 || "At most 60 characters.";
              },
            })}
          />
          {errors.name && (
            <p id="token-name-error" className="field-error">
              {errors.name.message}
            </p>
          )}
        </div>
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Making…" : "Make token"}
        </button>
      </form>

      {secret && (
        <div role="status" className="panel border-accent">
          <p className="text-sm font-semibold">Token “{secret.name}” — copy it now; it is not shown again.</p>
          <code className="num mt-2 block break-all rounded bg-paper-sunk p-2" data-testid="new-token">
            {secret.secret}
          </code>
          <button
            type="button"
            className="btn mt-2"
            onClick={() => navigator.clipboard?.writeText(secret.secret)}
          >
            Copy
          </button>
        </div>
      )}
      {(error || actionError) && (
        <p role="alert" className="field-error">
          {actionError ?? `Could not load your tokens: ${error?.message}`}
        </p>
      )}

      {data && data.tokens.length === 0 && (
        <p className="text-sm text-ink-soft">No tokens yet. Name one above to make it.</p>
      )}
      {data && data.tokens.length > 0 && (
        <table className="table-dense">
          <thead>
            <tr>
              <th>Name</th>
              <th>Starts with</th>
              <th>Made</th>
              <th>Last used</th>
              <th>State</th>
            </tr>
          </thead>
          <tbody>
            {data.tokens.map((t) => (
              <tr key={t.id}>
                <td>{t.name}</td>
                <td className="num">{t.prefix}…</td>
                <td className="num">{day(t.createdAt)}</td>
                <td className="num">{day(t.lastUsedAt)}</td>
                <td>
                  {t.revokedAt ? (
                    <span className="text-ink-muted">revoked {day(t.revokedAt)}</span>
                  ) : (
                    <button type="button" className="btn text-xs" onClick={() => revoke(t)}>
                      Revoke
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
