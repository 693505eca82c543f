// Any /api/v1 path no handler claims: our JSON 404, not the framework's HTML
// page, for every method (more specific routes always win over this one).
import { apiRoute } from "@/lib/api/route";
import { ApiError } from "@/lib/api/errors";

const unknown = apiRoute(async (req) => {
  const path = new URL(req.url).pathname;
  throw new ApiError(
    "not_found",
    `No API endpoint at ${path.slice(0, 200)}. The endpoints are listed in the API reference.`,
  );
});

export const GET = unknown;
export const POST = unknown;
export const PUT = unknown;
export const PATCH = unknown;
export const DELETE = unknown;
