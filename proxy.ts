/// Sends signed-out visitors of any app page to the sign-in page. API routes are not
/// matched: they answer 401 JSON themselves (lib/auth/current-user.ts).
import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

const PUBLIC_PAGES = new Set(["/sign-in", "/sign-up"]);

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PAGES.has(pathname)) return NextResponse.next();
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const target = new URL("/sign-in", request.url);
  target.searchParams.set("callbackUrl", `${pathname}${search}`);
  return NextResponse.redirect(target);
}

export const config = {
  matcher: ["/((?!api/|_next/|favicon\\.ico$|robots\\.txt$).*)"],
};
