import type { Metadata } from "next";
import { asc } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ADMIN } from "@/lib/auth/roles";
import { pendingInvitations } from "@/lib/review/invitations";
import { InviteForm } from "./invite-form";
import { UserRow } from "./user-row";

export const metadata: Metadata = { title: "Users" };

export default async function AdminPage() {
  const { user, allowed } = await pageUser(ADMIN);
  if (!allowed) return <NotAllowed role={user.role} what="user administration" />;
  const [rows, invites] = await Promise.all([
    db
      .select({
        id: users.id,
        name: users.name,
        email: users.email,
        role: users.role,
        site: users.site,
        disabled: users.disabled,
      })
      .from(users)
      .orderBy(asc(users.name)),
    pendingInvitations(),
  ]);
  return (
    <section className="space-y-8">
      <section aria-labelledby="users-h">
        <h1 id="users-h" className="text-xl font-semibold">
          Users
        </h1>
        <p className="mt-1 text-sm text-ink-soft">
          Technicians with a site see released bundles of that site only. Changes take effect on the
          user&apos;s next request and are written to the audit log.
        </p>
        <div className="mt-3 overflow-x-auto">
          <table className="table-dense" aria-label="Users">
            <thead>
              <tr>
                <th scope="col">Name</th>
                <th scope="col">E-mail</th>
                <th scope="col">Role</th>
                <th scope="col">Site</th>
                <th scope="col">Status</th>
                <th scope="col">
                  <span className="sr-only">Save</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {rows.map((u) => (
                <UserRow key={u.id} u={u} self={u.id === user.id} />
              ))}
            </tbody>
          </table>
        </div>
      </section>
      <section aria-labelledby="invite-h" className="panel space-y-3">
        <h2 id="invite-h" className="text-lg font-semibold">
          Invite a user
        </h2>
        <InviteForm />
        {invites.length > 0 && (
          <table className="table-dense" aria-label="Open invitations">
            <thead>
              <tr>
                <th scope="col">Invited</th>
                <th scope="col">Role</th>
                <th scope="col">Site</th>
                <th scope="col">Link valid until (UTC)</th>
              </tr>
            </thead>
            <tbody>
              {invites.map((i) => (
                <tr key={i.id}>
                  <td>
                    {i.name} <span className="num text-ink-muted">{i.email}</span>
                  </td>
                  <td>{i.role}</td>
                  <td>{i.site ?? "all sites"}</td>
                  <td className="num">{i.expiresAt.toISOString().slice(0, 16).replace("T", " ")}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </section>
  );
}
