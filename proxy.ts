import { withAuth } from "next-auth/middleware";

// Only redirects signed-out visitors to the sign-in page; every page and action still
// checks the user and their permissions itself (lib/auth). The API authenticates with
// bearer tokens and upload routes must not have their bodies cut, so /api stays out.
export default withAuth({ pages: { signIn: "/signin" } });

export const config = {
  matcher: ["/((?!api/|_next/|signin|signout|reset|welcome|favicon.ico|icon.svg).*)"],
};
