/// The pure parts of issue 13's web hardening: the client address behind trusted proxies,
/// the same-origin rule, the post-sign-in destination and the JSON guard. The HTTP
/// suites in tests/integration show the same rules on the running server.
import { describe, expect, it } from "vitest";
import { safeCallback } from "@/app/(auth)/safe-callback";
import {
  CLIENT_ADDRESS_HEADER,
  clientAddress,
  markClientAddressResolved,
  parseTrustedProxies,
  resolveClientAddress,
} from "@/lib/http/client-address";
import { nestingProblem, textProblem, valueProblem } from "@/lib/http/json-guard";
import { checkSameOrigin } from "@/lib/http/same-origin";

describe("resolveClientAddress", () => {
  const none = parseTrustedProxies("");
  const proxies = parseTrustedProxies("127.0.0.1, 10.0.0.0/8, ::1");

  it("takes the socket's peer and ignores X-Forwarded-For from an untrusted peer", () => {
    expect(resolveClientAddress("192.0.2.9", "203.0.113.5", none)).toBe("192.0.2.9");
    expect(resolveClientAddress("::ffff:192.0.2.9", "203.0.113.5", proxies)).toBe("192.0.2.9");
  });

  it("walks X-Forwarded-For from the right past trusted proxies only", () => {
    expect(resolveClientAddress("127.0.0.1", "203.0.113.5", proxies)).toBe("203.0.113.5");
    // a client that prepends a spoofed hop is still seen as itself
    expect(resolveClientAddress("127.0.0.1", "198.51.100.66, 203.0.113.5", proxies)).toBe("203.0.113.5");
    expect(resolveClientAddress("127.0.0.1", "203.0.113.5, 10.1.2.3", proxies)).toBe("203.0.113.5");
    expect(resolveClientAddress("127.0.0.1", ["203.0.113.5", "10.1.2.3"], proxies)).toBe("203.0.113.5");
    expect(resolveClientAddress("127.0.0.1", undefined, proxies)).toBe("127.0.0.1");
    expect(resolveClientAddress("127.0.0.1", "not-an-address", proxies)).toBe("127.0.0.1");
  });

  it("refuses a malformed proxy list instead of trusting nothing or everything", () => {
    expect(() => parseTrustedProxies("127.0.0.1, localhost")).toThrow(/localhost/);
    expect(() => parseTrustedProxies("10.0.0.0/33")).toThrow(/prefix/);
  });
});

describe("clientAddress", () => {
  it("believes the resolved-address header only when web-server.ts set it in this process", () => {
    const headers = new Headers({ [CLIENT_ADDRESS_HEADER]: "203.0.113.9", "X-Forwarded-For": "198.51.100.1" });
    expect(clientAddress(headers)).toBe("unknown");
    markClientAddressResolved();
    expect(clientAddress(headers)).toBe("203.0.113.9");
    expect(clientAddress(new Headers({ "X-Forwarded-For": "198.51.100.1" }))).toBe("unknown");
  });
});

describe("checkSameOrigin", () => {
  const opts = { host: "ringside.example", allowedOrigins: ["https://ringside.example"] };
  const h = (o: Record<string, string>) => new Headers(o);

  it("lets reads through and same-origin writes through", () => {
    expect(checkSameOrigin("GET", h({ Origin: "https://evil.example" }), opts).ok).toBe(true);
    expect(checkSameOrigin("POST", h({ Origin: "https://ringside.example" }), opts).ok).toBe(true);
    expect(checkSameOrigin("DELETE", h({ "Sec-Fetch-Site": "same-origin" }), opts).ok).toBe(true);
  });

  it.each([
    [{ Origin: "https://evil.example" }],
    [{ Origin: "https://ringside.example.evil.example" }],
    [{ Origin: "null" }],
    [{ Origin: "https://ringside.example", "Sec-Fetch-Site": "cross-site" }],
    [{ Origin: "https://ringside.example", "Sec-Fetch-Site": "same-site" }],
    [{}],
  ])("refuses a write with %j", (headers) => {
    for (const m of ["POST", "PUT", "PATCH", "DELETE"]) expect(checkSameOrigin(m, h(headers), opts).ok).toBe(false);
  });
});

describe("safeCallback", () => {
  it.each([
    "/\t/evil.example",
    "//evil.example",
    "/\\evil.example",
    "/\\/evil.example",
    "/\n/evil.example",
    "https://evil.example",
    "javascript:alert(1)",
    "",
  ])("sends %j home", (v) => expect(safeCallback(v)).toBe("/"));

  it("keeps same-site paths, queries and fragments", () => {
    expect(safeCallback("/teams?x=1#top")).toBe("/teams?x=1#top");
    expect(safeCallback(["/?session=abc", "/other"])).toBe("/?session=abc");
  });
});

describe("the JSON guard", () => {
  it("measures nesting in the text, ignoring brackets inside strings", () => {
    expect(nestingProblem(`${"[".repeat(64)}${"]".repeat(64)}`)).toBeNull();
    expect(nestingProblem(`${"[".repeat(65)}${"]".repeat(65)}`)).toMatch(/more than 64 levels/);
    expect(nestingProblem(JSON.stringify({ s: "[".repeat(1000) + '\\"' }))).toBeNull();
  });

  it("finds NUL, lone surrogates and inexact numbers with their path", () => {
    expect(textProblem("a\u0000")).toMatch(/NUL/);
    expect(textProblem("\ud800x")).toMatch(/surrogate/);
    expect(textProblem("x\udc00")).toMatch(/surrogate/);
    expect(textProblem("𝔽 ü")).toBeNull();
    expect(valueProblem({ a: [1, { b: "\u0000" }] })).toEqual({ path: "a.1.b", message: expect.stringMatching(/NUL/) });
    expect(valueProblem(JSON.parse('{"n": 1e400}'))?.path).toBe("n");
    expect(valueProblem({ n: 2 ** 60 })?.message).toMatch(/exactly/);
    expect(valueProblem({ n: 2 ** 53 - 1, x: 0.5, s: "fine" })).toBeNull();
  });
});
