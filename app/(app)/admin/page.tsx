import type { Metadata } from "next";
import { asc } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { NotAllowed } from "@/components/ui/not-allowed";
import { pageUser } from "@/lib/auth/page";
import { ADMIN, ROLE_LABELS } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Users" };

export default async function AdminPage() {
  const { user, allowed } = await pageUser(ADMIN);
  if (!allowed) return <NotAllowed role={user.role} what="user administration" />;
  const rows = await db.select().from(users).orderBy(asc(users.id));
  return (
    <section>
      <h1 className="text-xl font-semibold">Users</h1>
      <table className="table-dense mt-4">
        <thead>
          <tr>
            <th>Name</th>
            <th>E-mail</th>
            <th>Role</th>
            <th>Site</th>
            <th>Status</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((u) => (
            <tr key={u.id}>
              <td>{u.name}</td>
              <td className="num">{u.email}</td>
              <td>{ROLE_LABELS[u.role]}</td>
              <td>{u.site ?? "all sites"}</td>
              <td>{u.disabled ? "disabled" : "active"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
