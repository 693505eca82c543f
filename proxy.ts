// Redirects signed-out visitors to the sign-in page. Authorisation is not done
// here: every handler, action and page checks the role itself.
import { withAuth } from "next-auth/middleware";

export default withAuth({ pages: { signIn: "/sign-in" } });

export const config = {
  matcher: ["/((?!api|sign-in|invite|_next|favicon.ico|fonts).*)"],
};
