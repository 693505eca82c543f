import type { Role } from "@/db/schema";

export type NavItem = { href: string; label: string; roles: Role[] };

// What each role sees in the navigation. The pages check the same roles on the server.
export const NAV_ITEMS: NavItem[] = [
  { href: "/retrofits", label: "Retrofits", roles: ["admin", "engineer", "reviewer"] },
  { href: "/reviews", label: "Reviews", roles: ["admin", "reviewer", "engineer"] },
  { href: "/field", label: "Field", roles: ["admin", "technician", "engineer"] },
  { href: "/captures", label: "Captures", roles: ["admin", "engineer", "technician"] },
  { href: "/audit", label: "Audit log", roles: ["admin"] },
  { href: "/admin", label: "Users", roles: ["admin"] },
  { href: "/settings", label: "API tokens", roles: ["admin", "engineer", "reviewer", "technician"] },
];

export const navFor = (role: Role) => NAV_ITEMS.filter((i) => i.roles.includes(role));

/** Where a role lands after signing in. */
export const homeFor = (role: Role) => (role === "technician" ? "/field" : "/retrofits");
