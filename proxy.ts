/// Sends signed-out visitors of any app page to the sign-in page, except the console page
/// opened through a published read-only link (`/?session=…&link=…`) and an experiment's
/// page opened through its session's link (`/experiments/<id>?link=…`): the API decides
/// whether that link is valid, and the page shows the session read-only. API routes are
/// not matched: they answer 401 JSON themselves (lib/auth/current-user.ts).
import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

const PUBLIC_PAGES = new Set(["/sign-in", "/sign-up"]);

function isLinkVisit(request: NextRequest): boolean {
  const { pathname, searchParams } = request.nextUrl;
  if (!searchParams.get("link")) return false;
  return (pathname === "/" && Boolean(searchParams.get("session"))) || /^\/experiments\/[0-9a-f-]{36}$/.test(pathname);
}

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PAGES.has(pathname) || isLinkVisit(request)) return NextResponse.next();
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const target = new URL("/sign-in", request.url);
  target.searchParams.set("callbackUrl", `${pathname}${search}`);
  return NextResponse.redirect(target);
}

export const config = {
  matcher: ["/((?!api/|_next/|favicon\\.ico$|robots\\.txt$).*)"],
};
