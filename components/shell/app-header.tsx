import Link from "next/link";
import type { AuthUser } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { navFor } from "./nav-items";
import { SignOutButton } from "./sign-out-button";

export function AppHeader({ user }: { user: AuthUser }) {
  return (
    <header className="no-print border-b border-paper-line bg-paper-raised">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
        <Link href="/" className="font-mono text-base font-semibold tracking-tight">
          clockgraft
        </Link>
        <nav aria-label="Main" className="flex flex-wrap gap-1">
          {navFor(user.role).map((item) => (
            <Link key={item.href} href={item.href} className="rounded px-2 py-1 text-sm hover:bg-paper-sunk">
              {item.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span data-testid="signed-in-as">
            {user.name} · <span className="text-ink-muted">{ROLE_LABELS[user.role]}</span>
          </span>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
