import type { Role } from "@/db/schema";

declare module "next-auth" {
  interface Session {
    user: { id: number; role: Role; name?: string | null; email?: string | null };
  }
  interface User {
    role: Role;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid: number;
    role: Role;
    /** users.session_version at sign-in. */
    sv: number;
    /** Sign-in time (ms since the epoch): sessions end SESSION_ABSOLUTE_S after it, however active. */
    authAt: number;
  }
}
