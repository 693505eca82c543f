import { apiRoute, readJson } from "@/lib/api/route";
import { acceptInvitation } from "@/lib/review/invitations";

// POST /api/v1/invitations/accept { token, password }: no session needed; the
// one-time token is the credential. Creates the account and spends the link.
export const POST = apiRoute(async (req) => {
  const user = await acceptInvitation(await readJson(req));
  return Response.json({ user }, { status: 201 });
});
