/// The credentials route's 503 when the password-hash queue is full (issue 13, item 5), and
/// its recognition of next-auth's answer for a check the full queue refused. next-auth 4
/// answers an error thrown by authorize with status 401 and a redirect to
/// `${base}/error?error=${encodeURIComponent(error.message)}` (node_modules/next-auth/core/
/// routes/callback.js, the credentials branch), as JSON `{url}` when the body says
/// json=true and as a Location header otherwise (next-auth/next/index.js); the answers below
/// are built exactly so. tests/integration/hash-flood.test.ts shows the same over HTTP.
import { describe, expect, it } from "vitest";
import { busy, refusedForHashQueue } from "@/lib/auth/hash-refusal";
import { HashQueueFull, isHashQueueFull, MAX_WAITING } from "@/lib/auth/hash-slots";
import { HASH_QUEUE_FULL_ERROR } from "@/lib/auth/options";

const BASE = "http://127.0.0.1:3000/api/auth";
const errorUrl = (code: string) => `${BASE}/error?error=${encodeURIComponent(code)}`;

describe("the hash-queue refusal", () => {
  it("is a 503 with Retry-After and kind limit naming hashQueue, with the url next-auth's client reads", async () => {
    const answer = busy(new Request(`${BASE}/callback/credentials`, { method: "POST" }));
    expect(answer.status).toBe(503);
    expect(Number(answer.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = (await answer.json()) as { error: { code: string; message: string; details: unknown }; url: string };
    expect(body.error.code).toBe("busy");
    expect(body.error.details).toEqual({ kind: "limit", limit: "hashQueue", value: MAX_WAITING });
    expect(body.error.message).toContain(`(limit hashQueue = ${MAX_WAITING})`);
    expect(new URL(body.url).pathname).toBe("/sign-in");
  });

  it("recognises next-auth's answer for a refused check, JSON or redirect, and nothing else", async () => {
    const json = (code: string, status = 401) =>
      new Response(JSON.stringify({ url: errorUrl(code) }), { status, headers: { "Content-Type": "application/json" } });
    const redirect = (code: string) => new Response(null, { status: 302, headers: { Location: errorUrl(code) } });
    expect(await refusedForHashQueue(json(HASH_QUEUE_FULL_ERROR))).toBe(true);
    expect(await refusedForHashQueue(redirect(HASH_QUEUE_FULL_ERROR))).toBe(true);
    // a wrong password stays a 401
    expect(await refusedForHashQueue(json("CredentialsSignin"))).toBe(false);
    expect(await refusedForHashQueue(redirect("CredentialsSignin"))).toBe(false);
    // a successful sign-in (200 with the callback url) is never turned into a refusal
    expect(await refusedForHashQueue(json(HASH_QUEUE_FULL_ERROR, 200))).toBe(false);
    // and the answer is still readable afterwards (it was cloned, not consumed)
    const answer = json("CredentialsSignin");
    await refusedForHashQueue(answer);
    expect(((await answer.json()) as { url: string }).url).toBe(errorUrl("CredentialsSignin"));
  });
});

describe("isHashQueueFull", () => {
  it("knows the refusal also when another bundle's copy of the module threw it", () => {
    expect(isHashQueueFull(new HashQueueFull())).toBe(true);
    const copy = Object.assign(new Error("Too many sign-ins are being checked right now"), { name: "HashQueueFull" });
    expect(isHashQueueFull(copy)).toBe(true);
    expect(isHashQueueFull(new Error("HashQueueFull"))).toBe(false);
    expect(isHashQueueFull("HashQueueFull")).toBe(false);
  });
});
