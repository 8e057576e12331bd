/// Sign-in rate limiting per account and per client address, counted in PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { ACCOUNT_FAILURES, ADDRESS_FAILURES } from "@/lib/auth/rate-limit";
import { uniqueEmail } from "../helpers/fixtures";
import { TestClient, testAddress } from "../helpers/http";

afterAll(() => closeDb());

async function newAccount(client: TestClient, password: string): Promise<string> {
  const email = uniqueEmail("rate");
  expect((await client.json("/api/auth/signup", { email, name: "Rate Tester", password })).status).toBe(201);
  return email;
}

describe("sign-in rate limit", () => {
  it(`blocks an account after ${ACCOUNT_FAILURES} failures, even with the right password, with a clear 429`, async () => {
    const password = "right-password-5150";
    const email = await newAccount(new TestClient(testAddress(50)), password);
    // Each failure from a different address: the account limit alone must trigger.
    for (let i = 0; i < ACCOUNT_FAILURES; i++) {
      expect((await new TestClient(testAddress(60 + i)).signIn(email, "wrong-password-0")).status).toBe(401);
    }
    const blocked = await new TestClient(testAddress(70)).signIn(email, password);
    expect(blocked.status).toBe(429);
    expect(blocked.headers.get("retry-after")).toBe("900");
    const body = (await blocked.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toContain("this account");
    const hits = await db()
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.email, email), eq(auditLog.event, "signin_rate_limited")));
    expect(hits).toHaveLength(1);
    expect(hits[0]!.details).toEqual({ scope: "account" });
  });

  it("forgives earlier failures once the account signs in successfully", async () => {
    const password = "another-right-6262";
    const client = new TestClient(testAddress(51));
    const email = await newAccount(client, password);
    for (let i = 0; i < ACCOUNT_FAILURES - 1; i++) expect((await client.signIn(email, "wrong-password-1")).status).toBe(401);
    expect((await client.signIn(email, password)).status).toBe(200);
    for (let i = 0; i < ACCOUNT_FAILURES - 1; i++) expect((await client.signIn(email, "wrong-password-2")).status).toBe(401);
    expect((await client.signIn(email, password)).status).toBe(200);
  });

  it(`blocks an address after ${ADDRESS_FAILURES} failures across accounts, and only that address`, async () => {
    const noisy = new TestClient(testAddress(52));
    for (let i = 0; i < ADDRESS_FAILURES; i++) {
      expect((await noisy.signIn(uniqueEmail("nobody"), "guess-password-3")).status).toBe(401);
    }
    const password = "address-right-7373";
    const email = await newAccount(new TestClient(testAddress(53)), password);
    const blocked = await noisy.signIn(email, password);
    expect(blocked.status).toBe(429);
    expect(((await blocked.json()) as { error: { message: string } }).error.message).toContain("your address");
    expect((await new TestClient(testAddress(53)).signIn(email, password)).status).toBe(200);
  });
});
