/// Runs before every page and API route:
/// 1. refuses cross-origin state-changing requests (POST/PUT/PATCH/DELETE) with 403 JSON
///    (lib/http/same-origin.ts), for pages and API routes alike;
/// 2. sends signed-out visitors of any app page to the sign-in page, except the console page
///    opened through a published read-only link (`/?session=…&link=…`) and an experiment's
///    page opened through its session's link (`/experiments/<id>?link=…`): the API decides
///    whether that link is valid, and the page shows the session read-only. API routes are
///    not redirected: they answer 401 JSON themselves (lib/auth/current-user.ts);
/// 3. gives every page its own Content-Security-Policy nonce (lib/http/content-security.ts):
///    Next.js reads it from the request's policy header and marks its scripts with it.
import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";
import { contentSecurityPolicy, newNonce } from "@/lib/http/content-security";
import { checkSameOrigin, configuredOrigins } from "@/lib/http/same-origin";

const PUBLIC_PAGES = new Set(["/sign-in", "/sign-up", "/verify-email"]);

function isLinkVisit(request: NextRequest): boolean {
  const { pathname, searchParams } = request.nextUrl;
  if (!searchParams.get("link")) return false;
  return (pathname === "/" && Boolean(searchParams.get("session"))) || /^\/experiments\/[0-9a-f-]{36}$/.test(pathname);
}

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const verdict = checkSameOrigin(request.method, request.headers, {
    host: request.headers.get("host"),
    allowedOrigins: configuredOrigins(),
  });
  if (!verdict.ok) {
    return NextResponse.json({ error: { code: "cross_origin", message: `Refused: ${verdict.why}` } }, { status: 403 });
  }
  if (pathname.startsWith("/api/")) return NextResponse.next();
  if (!PUBLIC_PAGES.has(pathname) && !isLinkVisit(request)) {
    const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
    if (!token) {
      const target = new URL("/sign-in", request.url);
      target.searchParams.set("callbackUrl", `${pathname}${search}`);
      return NextResponse.redirect(target);
    }
  }
  const policy = contentSecurityPolicy(newNonce());
  const headers = new Headers(request.headers);
  headers.set("Content-Security-Policy", policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", policy);
  return response;
}

export const config = {
  matcher: ["/((?!_next/|favicon\\.ico$|robots\\.txt$).*)"],
};
