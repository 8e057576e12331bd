/// Limits at the request boundary (issue 13, item 8): the body bounds, the JSON nesting bound,
/// the password-hash queue, the sign-in rate limit and the e-mail link's lifetime are rows of
/// lib/limits.ts, and a refusal names its row with kind `limit`. Pure: Request objects, no
/// server (tests/integration shows the same refusals over HTTP).
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { readJson, readText } from "@/lib/http/body";
import { HttpError } from "@/lib/http/errors";
import { MAX_JSON_DEPTH } from "@/lib/http/json-guard";
import { HASH_SLOTS, MAX_WAITING } from "@/lib/auth/hash-slots";
import { ACCOUNT_FAILURES, ADDRESS_FAILURES, RATE_WINDOW_SECONDS } from "@/lib/auth/rate-limit";
import { VERIFICATION_LIFETIME_MS } from "@/lib/auth/email-verification";
import { SIGN_UP_ACCEPTED, signUpBody } from "@/lib/auth/signup";
import { NewTeam } from "@/lib/sharing/bodies";
import { UploadBody } from "@/lib/wire/experiments";
import { IMPORT_LIMITS } from "@/lib/export/format";
import { MAX_UPLOAD_LINES } from "@/lib/experiments/uploads";
import { formatLimit, LIMIT_TABLE, limitValue } from "@/lib/limits";

function post(body: string, headers: Record<string, string> = {}): Request {
  return new Request("http://127.0.0.1/x", { method: "POST", headers: { "content-type": "application/json", ...headers }, body });
}

async function refusal(promise: Promise<unknown>): Promise<HttpError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(HttpError);
  return error as HttpError;
}

describe("the module-level figures are the table's", () => {
  it("reads every former constant from lib/limits.ts", () => {
    expect(MAX_JSON_DEPTH).toBe(LIMIT_TABLE.jsonNesting.value);
    expect(HASH_SLOTS).toBe(limitValue("hashConcurrency"));
    expect(MAX_WAITING).toBe(limitValue("hashQueue"));
    expect(ACCOUNT_FAILURES).toBe(limitValue("signInAccountFailures"));
    expect(ADDRESS_FAILURES).toBe(limitValue("signInAddressFailures"));
    expect(RATE_WINDOW_SECONDS * 1000).toBe(limitValue("signInWindowMs"));
    expect(VERIFICATION_LIFETIME_MS).toBe(LIMIT_TABLE.emailVerificationMs.value);
    expect(IMPORT_LIMITS.cells).toBe(LIMIT_TABLE.importCells.value);
    expect(MAX_UPLOAD_LINES).toBe(LIMIT_TABLE.uploadLines.value);
  });

  it("formats times in the unit people read", () => {
    expect(formatLimit("emailVerificationMs")).toBe("48 h");
    expect(formatLimit("signInWindowMs")).toBe("15 min");
    expect(formatLimit("uploadReadMs", 90_000)).toBe("90 s");
    expect(formatLimit("invitationHours")).toBe("168 h");
  });

  it("tells a new account to look for the link in its mail, with the link's lifetime", () => {
    expect(SIGN_UP_ACCEPTED).toMatch(/check your mail/i);
    expect(SIGN_UP_ACCEPTED).toContain(formatLimit("emailVerificationMs"));
  });
});

describe("readJson refuses with kind limit, naming the row", () => {
  const Any = z.unknown();

  it("answers 413 naming the route's body limit, declared or streamed", async () => {
    const bound = limitValue("shortBodyBytes");
    const body = JSON.stringify({ title: "x".repeat(bound) });
    const declared = await refusal(readJson(post(body, { "content-length": String(body.length) }), Any, { limit: "shortBodyBytes" }));
    expect(declared.status).toBe(413);
    expect(declared.details).toEqual({ kind: "limit", limit: "shortBodyBytes", value: bound });
    expect(declared.message).toContain("(limit shortBodyBytes = 8 KiB)");
    // without Content-Length the body is counted while it streams
    const streamed = await refusal(readText(post(body), { limit: "shortBodyBytes" }));
    expect(streamed.status).toBe(413);
    expect(streamed.details).toMatchObject({ kind: "limit", limit: "shortBodyBytes" });
    // the same body fits the default bound
    expect(await readJson(post(body), Any)).toEqual({ title: "x".repeat(bound) });
  });

  it("names requestBodyBytes when the route names no bound, and keeps a field's slack", async () => {
    const body = JSON.stringify({ s: "y".repeat(limitValue("requestBodyBytes")) });
    expect((await refusal(readJson(post(body), Any))).details).toMatchObject({ limit: "requestBodyBytes" });
    const source = "z".repeat(limitValue("cellSourceBytes"));
    expect(await readJson(post(JSON.stringify({ source })), Any, { limit: "cellSourceBytes", slackBytes: 1024 })).toEqual({ source });
  });

  it("answers 400 naming jsonNesting one level past the bound, and accepts the bound itself", async () => {
    const depth = limitValue("jsonNesting");
    expect(await readJson(post(`${"[".repeat(depth)}${"]".repeat(depth)}`), Any)).toBeDefined();
    const deep = await refusal(readJson(post(`${"[".repeat(depth + 1)}${"]".repeat(depth + 1)}`), Any));
    expect(deep.status).toBe(400);
    expect(deep.code).toBe("too_deep");
    expect(deep.details).toEqual({ kind: "limit", limit: "jsonNesting", value: depth });
  });
});

describe("typed fields are bounded by rows of the table, named in the message", () => {
  const failure = (r: { success: boolean; error?: { issues: { message: string }[] } }) => r.error?.issues.map((i) => i.message).join("; ");

  it("a team name, a person's name and an upload's name and file", () => {
    const team = LIMIT_TABLE.teamNameChars.value;
    expect(NewTeam.safeParse({ name: "t".repeat(team) }).success).toBe(true);
    expect(failure(NewTeam.safeParse({ name: "t".repeat(team + 1) }))).toContain("limit teamNameChars");
    const person = LIMIT_TABLE.displayNameChars.value;
    const signUp = { email: "bound@example.test", password: "irrelevant-here-9" };
    expect(signUpBody.safeParse({ ...signUp, name: "n".repeat(person) }).success).toBe(true);
    expect(failure(signUpBody.safeParse({ ...signUp, name: "n".repeat(person + 1) }))).toContain("limit displayNameChars");
    const upload = { sessionId: "00000000-0000-4000-8000-000000000000", format: "text", ring: "Q[x]", content: "<x>" };
    const name = LIMIT_TABLE.objectNameChars.value;
    expect(UploadBody.safeParse({ ...upload, name: "u".repeat(name) }).success).toBe(true);
    expect(failure(UploadBody.safeParse({ ...upload, name: "u".repeat(name + 1) }))).toContain("limit objectNameChars");
    const big = "x".repeat(LIMIT_TABLE.uploadChars.value + 1);
    expect(failure(UploadBody.safeParse({ ...upload, name: "F", content: big }))).toContain("limit uploadChars");
  });
});
