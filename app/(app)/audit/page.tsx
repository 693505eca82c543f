import type { Metadata } from "next";
import Link from "next/link";
import { asc } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ADMIN } from "@/lib/auth/roles";
import { auditActions, auditFilter, readAudit, type AuditFilter } from "@/lib/review/audit-log";

export const metadata: Metadata = { title: "Audit log" };

type Search = Record<string, string | undefined>;

const when = (d: Date) => d.toISOString().slice(0, 19).replace("T", " ");

function subjectLink(type: string | null, id: number | null) {
  if (!type || !id) return "—";
  if (type === "revision")
    return (
      <Link href={`/revisions/${id}/review`} className="underline">
        revision {id}
      </Link>
    );
  if (type === "retrofit")
    return (
      <Link href={`/retrofits/${id}`} className="underline">
        retrofit {id}
      </Link>
    );
  return `${type} ${id}`;
}

export default async function AuditPage({ searchParams }: { searchParams: Promise<Search> }) {
  const { user, allowed } = await pageUser(ADMIN);
  if (!allowed) return <NotAllowed role={user.role} what="the audit log" />;
  const raw = await searchParams;
  const parsed = auditFilter.safeParse(raw);
  const filter: AuditFilter = parsed.success ? parsed.data : { action: undefined, page: 1 };
  const [{ events, more }, actions, people] = await Promise.all([
    readAudit(filter),
    auditActions(),
    db.select({ id: users.id, name: users.name, email: users.email }).from(users).orderBy(asc(users.name)),
  ]);
  const pageHref = (page: number) =>
    `/audit?${new URLSearchParams({ ...Object.fromEntries(Object.entries(raw).filter(([, v]) => v) as [string, string][]), page: String(page) })}`;

  return (
    <section className="space-y-4">
      <h1 className="text-xl font-semibold">Audit log</h1>
      <form method="get" className="flex flex-wrap items-end gap-3" aria-label="Filter the audit log">
        <div>
          <label htmlFor="f-action" className="field-label">
            Action
          </label>
          <select id="f-action" name="action" defaultValue={raw.action ?? ""} className="input w-56">
            <option value="">any action</option>
            {actions.map((a) => (
              <option key={a} value={a}>
                {a}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="f-actor" className="field-label">
            Who
          </label>
          <select id="f-actor" name="actor" defaultValue={raw.actor ?? ""} className="input w-56">
            <option value="">anyone</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.email})
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="f-from" className="field-label">
            From (UTC)
          </label>
          <input id="f-from" type="date" name="from" defaultValue={raw.from ?? ""} className="input" />
        </div>
        <div>
          <label htmlFor="f-to" className="field-label">
            To (UTC, inclusive)
          </label>
          <input id="f-to" type="date" name="to" defaultValue={raw.to ?? ""} className="input" />
        </div>
        <button type="submit" className="btn">
          Filter
        </button>
        <Link href="/audit" className="btn">
          Clear
        </Link>
      </form>
      {!parsed.success && (
        <p role="alert" className="field-error">
          Some filters were not understood and were left out:{" "}
          {parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}
        </p>
      )}
      {events.length === 0 ? (
        <p className="panel">No events match these filters. Widen the date range or clear the filters.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="table-dense" aria-label="Audit events">
            <thead>
              <tr>
                <th scope="col">When (UTC)</th>
                <th scope="col">Who</th>
                <th scope="col">Action</th>
                <th scope="col">Subject</th>
                <th scope="col">Details</th>
              </tr>
            </thead>
            <tbody>
              {events.map((e) => (
                <tr key={e.id} data-action={e.action}>
                  <td className="num whitespace-nowrap">{when(e.createdAt)}</td>
                  <td>{e.actor ?? (e.actorId ? `user ${e.actorId}` : "—")}</td>
                  <td className="num">{e.action}</td>
                  <td>{subjectLink(e.subjectType, e.subjectId)}</td>
                  <td className="num max-w-md break-all text-xs text-ink-soft">
                    {JSON.stringify(e.details)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <nav aria-label="Pages" className="flex gap-2">
        {filter.page > 1 && (
          <Link className="btn" href={pageHref(filter.page - 1)}>
            Newer
          </Link>
        )}
        {more && (
          <Link className="btn" href={pageHref(filter.page + 1)}>
            Older
          </Link>
        )}
      </nav>
    </section>
  );
}
