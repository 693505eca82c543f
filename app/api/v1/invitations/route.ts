import { apiRoute, readJson, secretJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ADMIN } from "@/lib/auth/roles";
import { createInvitation, invitationInput, pendingInvitations } from "@/lib/review/invitations";

// GET /api/v1/invitations (admins): open invitations.
export const GET = apiRoute(async (req) => {
  await requireUser({ roles: ADMIN, req });
  return Response.json({ invitations: await pendingInvitations() });
});

// POST /api/v1/invitations { email, name, role, site? } (admins): mails a one-time
// link; the answer carries the link too, once, for when mail is slow.
export const POST = apiRoute(async (req) => {
  const body = invitationInput.parse(await readJson(req));
  const admin = await requireUser({ roles: ADMIN, req });
  const { invitation, token } = await createInvitation(admin, body);
  const link = `${new URL(req.url).origin}/invite/${token}`;
  return secretJson({ invitation, link }, { status: 201 });
});
