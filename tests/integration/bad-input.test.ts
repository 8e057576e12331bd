/// Sign-up with bad input: clear 4xx JSON errors, no partial rows, no password stored in clear.
import { readFile } from "node:fs/promises";
import { afterAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { auditLog, users } from "@/db/schema";
import { bcryptCost } from "@/lib/auth/password";
import { testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";
import { waitForMail } from "../helpers/mail";

afterAll(() => closeDb());

const client = () => new TestClient(testAddress(40));
const GOOD_PASSWORD = "syzygy-module-2024";

async function errorOf(response: Response): Promise<{ code: string; message: string }> {
  const body = (await response.json()) as { error: { code: string; message: string } };
  expect(Object.keys(body)).toEqual(["error"]);
  return body.error;
}

async function rowsFor(email: string) {
  const u = await db().select().from(users).where(eq(users.email, email));
  const a = await db()
    .select()
    .from(auditLog)
    .where(sql`${auditLog.email} = ${email} AND ${auditLog.event} = 'signup'`);
  return { users: u.length, audits: a.length };
}

describe("sign-up with bad input", () => {
  // Issue 13 replaced the old 409 "email_taken": a taken address (in any letter case)
  // answers exactly as a free one, keeps the one account, and its owner gets a notice.
  it("answers a taken e-mail (in any letter case) exactly like a free one and keeps the one account", async () => {
    const email = uniqueEmail("taken");
    const first = await client().json("/api/auth/signup", { email, name: "Same Name", password: GOOD_PASSWORD });
    expect(first.status).toBe(201);
    const again = await client().json("/api/auth/signup", { email: email.toUpperCase(), name: "Same Name", password: GOOD_PASSWORD });
    expect(again.status).toBe(201);
    expect(await again.json()).toEqual(await first.json());
    expect(await rowsFor(email)).toEqual({ users: 1, audits: 1 });
    const notice = await waitForMail(email, (m) => m.subject.startsWith("Someone tried"));
    expect(notice.text).toContain("already has one");
  });

  // The strength estimator (zxcvbn) replaced the letter-and-digit rule; the intent stays:
  // a weak password answers 400 with the reason and the rule, and creates nothing.
  it.each([
    ["short", "a1b2c3", "shorter than 10"],
    ["a common password with digits", "password1234", "too easy to guess"],
    ["a keyboard row", "qwertyuiop12", "too easy to guess"],
    ["only digits", "1234567890123", "too easy to guess"],
    ["repeated characters", "aaaaaaaaaaaa1", "Repeated characters"],
    ["the account's own address", "(the e-mail address)", "too easy to guess"],
    ["over 72 bytes", `${"é".repeat(37)}1`, "72 bytes"],
  ])("answers 400 with the rule for a weak password (%s) and creates nothing", async (_label, password, why) => {
    const email = uniqueEmail("weakling");
    if (password === "(the e-mail address)") password = email;
    const response = await client().json("/api/auth/signup", { email, name: "Weak", password });
    expect(response.status).toBe(400);
    const error = await errorOf(response);
    expect(error.code).toBe("weak_password");
    expect(error.message).toContain(why);
    expect(error.message).toContain("at least 10 characters");
    expect(await rowsFor(email)).toEqual({ users: 0, audits: 0 });
  });

  it("answers 400 for malformed JSON, saying so", async () => {
    const response = await client().request("/api/auth/signup", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: '{"email": "x@y.example", "name": ',
    });
    expect(response.status).toBe(400);
    const error = await errorOf(response);
    expect(error.code).toBe("malformed_json");
    expect(error.message).toMatch(/not valid JSON/);
  });

  it("answers 400 naming the field for a missing name and an invalid e-mail", async () => {
    const missing = await client().json("/api/auth/signup", { email: uniqueEmail("noname"), password: GOOD_PASSWORD });
    expect(missing.status).toBe(400);
    expect((await errorOf(missing)).message).toContain("name");
    const invalid = await client().json("/api/auth/signup", { email: "not-an-address", name: "X", password: GOOD_PASSWORD });
    expect(invalid.status).toBe(400);
    expect((await errorOf(invalid)).message).toContain("email");
  });

  it("answers 413 for an oversized body, declared or streamed", async () => {
    const email = uniqueEmail("huge");
    const big = JSON.stringify({ email, name: "x".repeat(20_000), password: GOOD_PASSWORD });
    const declared = await client().request("/api/auth/signup", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: big,
    });
    expect(declared.status).toBe(413);
    expect(declared.headers.get("connection")).toBe("close");
    expect((await errorOf(declared)).code).toBe("body_too_large");

    const bytes = new TextEncoder().encode(big);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < bytes.length; i += 4096) controller.enqueue(bytes.slice(i, i + 4096));
        controller.close();
      },
    });
    const chunked = await client().request("/api/auth/signup", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: stream,
      duplex: "half",
    } as RequestInit);
    expect(chunked.status).toBe(413);
    expect(await rowsFor(email)).toEqual({ users: 0, audits: 0 });
  });

  it("answers 415 for a body that is not declared as JSON", async () => {
    const response = await client().request("/api/auth/signup", { method: "POST", headers: { "Content-Type": "text/plain" }, body: "{}" });
    expect(response.status).toBe(415);
  });

  it("stores only a bcrypt hash and never the password in the audit log or the server log", async () => {
    const email = uniqueEmail("secret");
    const password = "unmistakable-secret-9137";
    expect((await client().json("/api/auth/signup", { email, name: "Secret", password })).status).toBe(201);
    await client().signIn(email, "unmistakable-wrong-4409");
    const [user] = await db().select().from(users).where(eq(users.email, email));
    expect(user!.passwordHash).toMatch(new RegExp(`^\\$2[aby]\\$${String(bcryptCost()).padStart(2, "0")}\\$`));
    const audit = await db().select().from(auditLog).where(eq(auditLog.email, email));
    expect(audit.map((a) => a.event).sort()).toEqual(["signin_failure", "signup"]);
    const dump = JSON.stringify(audit);
    expect(dump).not.toContain(password);
    expect(dump).not.toContain("unmistakable-wrong-4409");
    const log = await readFile(testEnv("RINGSIDE_TEST_SERVER_LOG"), "utf8");
    expect(log).not.toContain(password);
    expect(log).not.toContain("unmistakable-wrong-4409");
  });
});
