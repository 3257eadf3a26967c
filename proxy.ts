import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";
import { newNonce, pageCsp } from "@/lib/http/security-headers";

/** Pages anyone may open: signing in, out, and choosing a password from an e-mailed link. */
const PUBLIC_PAGES = ["/signin", "/signout", "/reset", "/welcome"];

const isPublic = (pathname: string) => PUBLIC_PAGES.some((page) => pathname === page || pathname.startsWith(`${page}/`));

/**
 * Every page: a Content-Security-Policy with a fresh nonce (Next.js reads it from the request and
 * puts it on its own scripts), and signed-out visitors sent to the sign-in page. Pages and actions
 * still check the user, their session and their permissions themselves (lib/auth). The API is
 * left out: it authenticates itself, and upload bodies must reach it uncut.
 */
export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (isForeignServerAction(request)) {
    // Next.js refuses these too, but as a 500; say plainly that it is not allowed.
    return NextResponse.json(
      { error: { code: "forbidden", message: "Forms of other sites may not act here." } },
      { status: 403, headers: { connection: "close" } },
    );
  }
  if (!isPublic(pathname) && !(await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET }))) {
    const signIn = new URL("/signin", request.url);
    signIn.searchParams.set("callbackUrl", `${pathname}${search}`);
    return NextResponse.redirect(signIn);
  }
  const csp = pageCsp(newNonce(), {
    development: process.env.NODE_ENV === "development",
    https: request.headers.get("x-forwarded-proto") === "https",
  });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", csp);
  return response;
}

/** A server action posted by a page of another site (the browser names that site in Origin). */
function isForeignServerAction(request: NextRequest): boolean {
  if (request.method !== "POST" || !request.headers.has("next-action")) return false;
  const origin = request.headers.get("origin");
  if (!origin) return false;
  const hosts = [request.headers.get("x-forwarded-host"), request.headers.get("host")].filter(Boolean);
  try {
    return !hosts.includes(new URL(origin).host);
  } catch {
    return true;
  }
}

export const config = {
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|icon.svg).*)"],
};
