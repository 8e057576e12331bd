/// Runs before every page and API route:
/// 1. refuses cross-origin state-changing requests (POST/PUT/PATCH/DELETE) with 403 JSON
///    (lib/http/same-origin.ts), for pages and API routes alike;
/// 2. sends signed-out visitors of any app page to the sign-in page, except the console page
///    opened through a published read-only link (`/?session=…&link=…`): the API decides
///    whether that link is valid, and the page shows the session read-only. API routes are
///    not redirected: they answer 401 JSON themselves (lib/auth/current-user.ts).
import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";
import { checkSameOrigin, configuredOrigins } from "@/lib/http/same-origin";

const PUBLIC_PAGES = new Set(["/sign-in", "/sign-up", "/verify-email"]);

function isLinkVisit(request: NextRequest): boolean {
  const { pathname, searchParams } = request.nextUrl;
  return pathname === "/" && Boolean(searchParams.get("session")) && Boolean(searchParams.get("link"));
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
  if (PUBLIC_PAGES.has(pathname) || isLinkVisit(request)) return NextResponse.next();
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const target = new URL("/sign-in", request.url);
  target.searchParams.set("callbackUrl", `${pathname}${search}`);
  return NextResponse.redirect(target);
}

export const config = {
  matcher: ["/((?!_next/|favicon\\.ico$|robots\\.txt$).*)"],
};
