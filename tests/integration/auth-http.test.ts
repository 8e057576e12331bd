/// Sign-up → sign-in → protected API over HTTP against the production server, and the
/// 401/403 answers for every role.
import { readFile } from "node:fs/promises";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { listMessages } from "@/lib/mail/mailbox";
import { testEnv } from "../helpers/env";
import { ensureTestGroup, TEST_ACCOUNTS, uniqueEmail, type FixtureKey } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

beforeAll(async () => {
  await ensureTestGroup();
});
afterAll(() => closeDb());

async function signedIn(key: FixtureKey, address: number): Promise<TestClient> {
  const client = new TestClient(testAddress(address));
  const response = await client.signIn(TEST_ACCOUNTS[key].email, TEST_ACCOUNTS[key].password);
  expect(response.status, `sign-in of the ${key} fixture`).toBe(200);
  return client;
}

describe("sign-up, sign-in, protected API", () => {
  it("creates an account, signs it in and serves its profile, then signs it out", async () => {
    const client = new TestClient(testAddress(10));
    const email = uniqueEmail("flow");
    const password = "coherent-sheaf-31";
    const created = await client.json("/api/auth/signup", { email: email.toUpperCase(), name: "Flow Tester", password });
    expect(created.status).toBe(201);
    expect(((await created.json()) as { user: { email: string } }).user.email).toBe(email);

    expect((await client.request("/api/me")).status).toBe(401);
    expect((await client.signIn(email, password)).status).toBe(200);
    expect(client.hasSession()).toBe(true);

    const signInAgain = await client.request("/sign-in");
    expect(new URL(signInAgain.headers.get("location") ?? "/sign-in", client.base).pathname).toBe("/");

    const me = await client.request("/api/me");
    expect(me.status).toBe(200);
    expect(await me.json()).toMatchObject({ user: { email, name: "Flow Tester", siteRole: "member", teams: [] } });

    await client.signOut();
    expect(client.hasSession()).toBe(false);
    expect((await client.request("/api/me")).status).toBe(401);
  });

  it("sends the new account a welcome message that the SMTP sink stores", async () => {
    const client = new TestClient(testAddress(11));
    const email = uniqueEmail("mail");
    expect((await client.json("/api/auth/signup", { email, name: "Mail Tester", password: "graded-module-77" })).status).toBe(201);
    const messages = await listMessages(1000, testEnv("RINGSIDE_MAIL_DIR"));
    const welcome = messages.find((m) => m.envelopeTo.includes(email));
    expect(welcome?.subject).toBe("Welcome to Ringside");
    expect(welcome?.text).toContain("Mail Tester");
  });

  it("refuses a wrong password with 401 and sets no session", async () => {
    const client = new TestClient(testAddress(12));
    const response = await client.signIn(TEST_ACCOUNTS.member.email, "not-the-password-1");
    expect(response.status).toBe(401);
    expect(client.hasSession()).toBe(false);
  });
});

describe("401 and 403 for each role", () => {
  it("answers 401 with a JSON error to a signed-out caller of every protected route", async () => {
    const client = new TestClient(testAddress(13));
    for (const path of ["/api/me", "/api/admin/audit"]) {
      const response = await client.request(path);
      expect(response.status, path).toBe(401);
      expect(await response.json()).toEqual({ error: { code: "unauthorized", message: expect.any(String) } });
    }
  });

  it("redirects a signed-out visitor of an app page to the sign-in page", async () => {
    const client = new TestClient(testAddress(13));
    for (const path of ["/", "/mailbox", "/sign-out"]) {
      const response = await client.request(path);
      expect(response.status, path).toBeGreaterThanOrEqual(300);
      expect(response.status, path).toBeLessThan(400);
      expect(new URL(response.headers.get("location")!, client.base).pathname, path).toBe("/sign-in");
    }
    expect((await client.request("/sign-in")).status).toBe(200);
    expect((await client.request("/sign-up")).status).toBe(200);
  });

  const teamRoles: Array<[FixtureKey, string]> = [
    ["lead", "lead"],
    ["member", "member"],
    ["guest", "guest"],
  ];
  it.each(teamRoles)("gives the team %s their profile but 403 on admin routes and the mailbox", async (key, role) => {
    const client = await signedIn(key, 20 + teamRoles.findIndex(([k]) => k === key));
    const me = await client.request("/api/me");
    expect(me.status).toBe(200);
    const body = (await me.json()) as { user: { siteRole: string; teams: Array<{ role: string }> } };
    expect(body.user.siteRole).toBe("member");
    expect(body.user.teams.map((t) => t.role)).toContain(role);

    const admin = await client.request("/api/admin/audit");
    expect(admin.status).toBe(403);
    expect(await admin.json()).toEqual({ error: { code: "forbidden", message: expect.stringContaining("admin") } });

    const mailbox = await client.request("/mailbox");
    expect(await mailbox.text()).toContain("The mailbox is for site admins");
  });

  it("lets the site admin read the audit log and the mailbox", async () => {
    const client = await signedIn("admin", 30);
    const audit = await client.request("/api/admin/audit?limit=50");
    expect(audit.status).toBe(200);
    const { entries } = (await audit.json()) as { entries: Array<{ event: string; email: string }> };
    expect(entries.some((e) => e.event === "signin_success" && e.email === TEST_ACCOUNTS.admin.email)).toBe(true);
    const mailbox = await client.request("/mailbox");
    expect(mailbox.status).toBe(200);
    const page = await mailbox.text();
    expect(page).toContain("Every message sent through the local SMTP sink");
    // The sign-ups earlier in this file each sent one.
    expect(page).toContain("Welcome to Ringside");
  });

  it("never writes a fixture password into the server log", async () => {
    const log = await readFile(testEnv("RINGSIDE_TEST_SERVER_LOG"), "utf8");
    for (const account of Object.values(TEST_ACCOUNTS)) expect(log).not.toContain(account.password);
  });
});
