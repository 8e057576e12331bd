/// Web hardening (issue 13, item 6) against the real server: post-sign-in destinations stay
/// on this site however the path is disguised; cross-origin state-changing requests are
/// refused; every answer carries the security headers; the mail sink keeps its folder and
/// messages private; sign-up does not reveal accounts and an unconfirmed address cannot be
/// shared with.
import { readdir, stat } from "node:fs/promises";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { TEST_ACCOUNTS, ensureTestGroup, uniqueEmail } from "../helpers/fixtures";
import { testEnv } from "../helpers/env";
import { TestClient, testAddress } from "../helpers/http";
import { confirmAddress, waitForMail } from "../helpers/mail";

const member = new TestClient(testAddress(120));

beforeAll(async () => {
  await ensureTestGroup();
  expect((await member.signIn(TEST_ACCOUNTS.member.email, TEST_ACCOUNTS.member.password)).status).toBe(200);
}, 60_000);
afterAll(() => closeDb());

// The forms that escape a prefix check: a tab (dropped by URL parsers), two slashes, a
// backslash (read as a slash), an absolute URL, and the same percent-encoded.
const ESCAPES = ["/\t/evil.example", "//evil.example", "/\\evil.example", "/\\/evil.example", "https://evil.example/", "/\n/evil.example"];

describe("callbackUrl", () => {
  it.each(ESCAPES)("never leaves the site after sign-in (%j)", async (escape) => {
    const r = await member.request(`/sign-in?callbackUrl=${encodeURIComponent(escape)}`);
    expect([302, 303, 307, 308]).toContain(r.status);
    const target = new URL(r.headers.get("location")!, member.base);
    expect(target.origin).toBe(new URL(member.base).origin);
    expect(target.host).not.toContain("evil");
  });

  it("keeps a same-site path with its query", async () => {
    const r = await member.request(`/sign-in?callbackUrl=${encodeURIComponent("/teams?x=1")}`);
    expect(new URL(r.headers.get("location")!, member.base).pathname + new URL(r.headers.get("location")!, member.base).search).toBe(
      "/teams?x=1",
    );
  });

  it.each(ESCAPES)("is refused by the credentials callback too (%j)", async (escape) => {
    const client = new TestClient(testAddress(121));
    const csrf = (await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const form = new URLSearchParams({
      csrfToken: csrf.csrfToken,
      email: TEST_ACCOUNTS.guest.email,
      password: TEST_ACCOUNTS.guest.password,
      json: "true",
      callbackUrl: escape,
    });
    const r = await client.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: form.toString(),
    });
    expect(r.status).toBe(200);
    const { url } = (await r.json()) as { url: string };
    expect(new URL(url, client.base).origin).toBe(new URL(client.base).origin);
  });
});

describe("cross-origin requests", () => {
  it("refuses a cross-origin POST, PATCH and DELETE with 403 and changes nothing", async () => {
    const created = await member.json("/api/sessions", { title: "origin check" });
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: string };
    const evil = { Origin: "https://evil.example", "Content-Type": "application/json" };
    const post = await member.request("/api/sessions", { method: "POST", headers: evil, body: JSON.stringify({ title: "forged" }) });
    expect(post.status).toBe(403);
    expect(((await post.json()) as { error: { code: string } }).error.code).toBe("cross_origin");
    const link = await member.request(`/api/sessions/${id}/link`, { method: "POST", headers: { Origin: "https://evil.example" } });
    expect(link.status).toBe(403);
    expect((await member.request(`/api/sessions/${id}/link`, { method: "POST" })).status).toBe(201);
    const del = await member.request(`/api/sessions/${id}/link`, { method: "DELETE", headers: { Origin: "https://evil.example" } });
    expect(del.status).toBe(403);
    const patch = await member.request(`/api/sessions/${id}/objects/00000000-0000-4000-8000-000000000000`, {
      method: "PATCH",
      headers: evil,
      body: JSON.stringify({ name: "forged" }),
    });
    expect(patch.status).toBe(403);
    const titles = ((await (await member.request("/api/sessions")).json()) as { sessions: { title: string }[] }).sessions.map(
      (s) => s.title,
    );
    expect(titles).not.toContain("forged");
    // the link published from our own origin is still there
    const session = (await (await member.request(`/api/sessions/${id}`)).json()) as { session: Record<string, unknown> };
    expect(session.session).toBeDefined();
  });

  it("refuses what Fetch Metadata marks cross-site, an opaque origin, and a request with no origin at all", async () => {
    const same = new URL(member.base).origin;
    const site = await member.request("/api/sessions", {
      method: "POST",
      headers: { Origin: same, "Sec-Fetch-Site": "cross-site", "Content-Type": "application/json" },
      body: JSON.stringify({ title: "x" }),
    });
    expect(site.status).toBe(403);
    const opaque = await member.request("/api/sessions", {
      method: "POST",
      headers: { Origin: "null", "Content-Type": "application/json" },
      body: "{}",
    });
    expect(opaque.status).toBe(403);
    const bare = await fetch(new URL("/api/auth/signup", member.base), {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ email: uniqueEmail("bare"), name: "Bare", password: "no-origin-header-4410" }),
    });
    expect(bare.status).toBe(403);
  });

  it("refuses a cross-origin sign-in (login CSRF) before next-auth sees it", async () => {
    const client = new TestClient(testAddress(122));
    const csrf = (await (await client.request("/api/auth/csrf")).json()) as { csrfToken: string };
    const r = await client.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { Origin: "https://evil.example", "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({
        csrfToken: csrf.csrfToken,
        email: TEST_ACCOUNTS.guest.email,
        password: TEST_ACCOUNTS.guest.password,
        json: "true",
      }).toString(),
    });
    expect(r.status).toBe(403);
    expect(client.hasSession()).toBe(false);
  });

  it("lets reads through from anywhere (GET changes nothing)", async () => {
    const r = await member.request("/api/me", { headers: { Origin: "https://evil.example", "Sec-Fetch-Site": "cross-site" } });
    expect(r.status).toBe(200);
  });
});

describe("security headers", () => {
  it.each(["/sign-in", "/", "/api/me", "/api/sessions", "/reference"])("are on %s", async (p) => {
    const r = await member.request(p);
    const csp = r.headers.get("content-security-policy") ?? "";
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(r.headers.get("x-content-type-options")).toBe("nosniff");
    expect(r.headers.get("referrer-policy")).toBe("same-origin");
    const scripts = /script-src ([^;]*)/.exec(csp)?.[1] ?? "";
    expect(scripts).not.toContain("unsafe-inline");
    expect(scripts).not.toContain("unsafe-eval");
  });

  it("give every page view its own script nonce, used on the page's scripts", async () => {
    const nonces: string[] = [];
    for (let i = 0; i < 2; i++) {
      const r = await member.request("/reference");
      const csp = r.headers.get("content-security-policy") ?? "";
      const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
      expect(nonce).toBeDefined();
      expect(csp).toContain("'strict-dynamic'");
      const html = await r.text();
      expect(html).toContain(`nonce="${nonce}"`);
      // every script tag of the page carries it
      const tags = html.match(/<script\b[^>]*>/g) ?? [];
      expect(tags.length).toBeGreaterThan(0);
      for (const tag of tags) expect(tag).toContain(`nonce="${nonce}"`);
      nonces.push(nonce!);
    }
    expect(nonces[0]).not.toBe(nonces[1]);
  });
});

describe("the mail sink", () => {
  it("keeps its folder at mode 700 and every message at 600", async () => {
    const email = uniqueEmail("sink");
    expect(
      (await new TestClient(testAddress(123)).json("/api/auth/signup", { email, name: "Sink", password: "private-mailbox-5531" })).status,
    ).toBe(201);
    await waitForMail(email);
    const dir = testEnv("RINGSIDE_MAIL_DIR");
    expect((await stat(dir)).mode & 0o777).toBe(0o700);
    const names = (await readdir(dir)).filter((n) => n.endsWith(".json"));
    expect(names.length).toBeGreaterThan(0);
    for (const n of names) expect((await stat(path.join(dir, n))).mode & 0o777).toBe(0o600);
  });
});

describe("accounts stay private", () => {
  it("sign-up answers alike for a taken and a free address", async () => {
    const taken = await new TestClient(testAddress(124)).json("/api/auth/signup", {
      email: TEST_ACCOUNTS.lead.email,
      name: "Impostor",
      password: "impostor-attempt-9921",
    });
    const free = await new TestClient(testAddress(124)).json("/api/auth/signup", {
      email: uniqueEmail("free"),
      name: "Impostor",
      password: "impostor-attempt-9921",
    });
    expect(taken.status).toBe(free.status);
    const a = (await taken.json()) as { message: string; user: { email: string } };
    const b = (await free.json()) as { message: string; user: { email: string } };
    expect(Object.keys(a).sort()).toEqual(Object.keys(b).sort());
    expect(a.message).toBe(b.message);
    // and the real owner was not signed out or changed: the fixture password still works
    expect((await new TestClient(testAddress(125)).signIn(TEST_ACCOUNTS.lead.email, TEST_ACCOUNTS.lead.password)).status).toBe(200);
  });

  it("sharing answers alike for an unconfirmed account and no account, and the share waits for confirmation", async () => {
    const email = uniqueEmail("claimant");
    const claimant = new TestClient(testAddress(126));
    expect((await claimant.json("/api/auth/signup", { email, name: "Claimant", password: "claimed-address-7702" })).status).toBe(201);
    expect((await claimant.signIn(email, "claimed-address-7702")).status).toBe(200);
    const { id } = (await (await member.json("/api/sessions", { title: "to share" })).json()) as { id: string };
    const early = await member.json(`/api/sessions/${id}/shares`, { email, role: "viewer" });
    const nobody = await member.json(`/api/sessions/${id}/shares`, { email: uniqueEmail("nobody"), role: "viewer" });
    const known = await member.json(`/api/sessions/${id}/shares`, { email: TEST_ACCOUNTS.guest.email, role: "viewer" });
    expect([early.status, nobody.status, known.status]).toEqual([201, 201, 201]);
    const shapes = await Promise.all(
      [early, nobody, known].map(async (r) =>
        JSON.stringify(Object.keys(((await r.json()) as { share: { grantee: object } }).share.grantee).sort()),
      ),
    );
    expect(new Set(shapes).size).toBe(1);
    // someone who signed up with an address they do not own receives nothing
    expect((await claimant.request(`/api/sessions/${id}`)).status).toBe(404);
    // once the mailbox's owner confirms it, the waiting share reaches the account
    await confirmAddress(claimant, email);
    expect((await claimant.request(`/api/sessions/${id}`)).status).toBe(200);
  });
});
