/// A read-only link carries its token as `?link=` on the page and the API calls it makes.
export function linkToken(req: Request): string | null {
  return new URL(req.url).searchParams.get("link");
}
