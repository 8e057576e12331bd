/// The authorisation matrix over the real API: every route file under app/api, every
/// method it exports, and every caller role (owner, editor, viewer, link holder, team
/// lead, member, guest, stranger, signed out, a signed-out link holder, plus the site
/// admin) against the expected
/// status. The route files are ENUMERATED from the folder, so a new route without rows
/// here fails the first test. Each request runs against targets made fresh for it, so a
/// granted mutation never changes what the next role sees.
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db/client";
import { experiments, invitations, namedObjects, sessions } from "@/db/schema";
import { newToken, tokenHash } from "@/lib/sharing/common";
import { EXPORT_FORMAT } from "@/lib/export/format";
import { uniqueEmail } from "../helpers/fixtures";
import type { TestClient } from "../helpers/http";
import { cleanUp, freshExperiment, freshSession, freshTeam, makeWorld, ownSession, type Actor, type World } from "./setup";

const API = path.resolve(__dirname, "..", "..", "app", "api");
const ROLES = [
  "owner",
  "editor",
  "viewer",
  "linkHolder",
  "lead",
  "member",
  "guest",
  "stranger",
  "signedOut",
  "signedOutLink",
  "admin",
] as const;
type Role = (typeof ROLES)[number];

type Request = { path: string; method: string; body?: unknown; form?: boolean };
interface Row {
  method: string;
  /// statuses in ROLES order
  expect: [number, number, number, number, number, number, number, number, number, number, number];
  make: (w: World, role: Role) => Promise<Omit<Request, "method">>;
}

// "link" is a signed-in holder of the session's link, "out+link" a signed-out one.
//                         owner editor viewer link lead member guest stranger out out+link admin
const READ: Row["expect"] = [200, 200, 200, 200, 200, 200, 200, 404, 401, 200, 404];
const EDIT: Row["expect"] = [200, 200, 403, 403, 200, 200, 403, 404, 401, 401, 404];
const MANAGE: Row["expect"] = [200, 403, 403, 403, 200, 403, 403, 404, 401, 401, 404];
const MANAGE_CREATE: Row["expect"] = [201, 403, 403, 403, 201, 403, 403, 404, 401, 401, 404];
const SIGNED_IN: Row["expect"] = [200, 200, 200, 200, 200, 200, 200, 200, 401, 401, 200];
const SIGNED_IN_CREATE: Row["expect"] = [201, 201, 201, 201, 201, 201, 201, 201, 401, 401, 201];
/// Renaming and deleting a session: its owner alone (issue 18).
const OWNER_ONLY: Row["expect"] = [200, 403, 403, 403, 403, 403, 403, 404, 401, 401, 404];
const EDIT_CREATE: Row["expect"] = [201, 201, 403, 403, 201, 201, 403, 404, 401, 401, 404];
// a create naming the session in its body: no link goes with it, so a signed-in link holder
// is a stranger to the session (404)
const BODY_CREATE: Row["expect"] = [201, 201, 403, 404, 201, 201, 403, 404, 401, 401, 404];
// an editor's pause, resume or cancel the experiment's status forbids: 409
const EDIT_CONFLICT: Row["expect"] = [409, 409, 403, 403, 409, 409, 403, 404, 401, 401, 404];
const TEAM_LEAD: Row["expect"] = [403, 403, 403, 403, 200, 403, 403, 403, 401, 401, 403];

function importDoc() {
  return {
    format: EXPORT_FORMAT,
    version: 1,
    exportedAt: new Date().toISOString(),
    session: { title: "imported in the matrix", ownerName: "someone" },
    cells: [],
    objects: [],
  };
}

async function invitationFor(teamId: string, email: string, invitedBy: string): Promise<string> {
  const token = newToken();
  await db()
    .insert(invitations)
    .values({ teamId, email, role: "member", tokenHash: tokenHash(token), invitedBy, expiresAt: new Date(Date.now() + 3600_000) });
  return token;
}

const MATRIX: Record<string, Row[]> = {
  "admin/audit/route.ts": [
    {
      method: "GET",
      expect: [403, 403, 403, 403, 403, 403, 403, 403, 401, 401, 200],
      make: async () => ({ path: "/api/admin/audit?limit=1" }),
    },
  ],
  "auth/[...nextauth]/route.ts": [
    { method: "GET", expect: [200, 200, 200, 200, 200, 200, 200, 200, 200, 200, 200], make: async () => ({ path: "/api/auth/csrf" }) },
    // A credentials post without a CSRF token is turned away by next-auth itself.
    {
      method: "POST",
      expect: [302, 302, 302, 302, 302, 302, 302, 302, 302, 302, 302],
      make: async () => ({
        path: "/api/auth/callback/credentials",
        body: { email: "nobody@harbor.test.example", password: "x" },
        form: true,
      }),
    },
  ],
  "auth/signup/route.ts": [
    {
      method: "POST",
      expect: [400, 400, 400, 400, 400, 400, 400, 400, 400, 400, 400],
      make: async () => ({ path: "/api/auth/signup", body: {} }),
    },
  ],
  "me/route.ts": [{ method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/me" }) }],
  "sessions/route.ts": [
    { method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/sessions" }) },
    { method: "POST", expect: SIGNED_IN_CREATE, make: async () => ({ path: "/api/sessions", body: { title: "matrix" } }) },
  ],
  "sessions/[id]/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}` }) },
    {
      method: "PATCH",
      expect: OWNER_ONLY,
      make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}`, body: { title: "renamed in the matrix" } }),
    },
    { method: "DELETE", expect: OWNER_ONLY, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}` }) },
  ],
  "library/route.ts": [{ method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/library?q=n" }) }],
  "history/route.ts": [{ method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/history?q=n" }) }],
  "sessions/[id]/cells/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/cells` }) },
    {
      method: "POST",
      expect: EDIT,
      make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/cells`, body: { source: "1 + 1" } }),
    },
  ],
  "sessions/[id]/cells/[cell]/cancel/route.ts": [
    {
      method: "POST",
      // editors reach the cell, which has finished: 409
      expect: [409, 409, 403, 403, 409, 409, 403, 404, 401, 401, 404],
      make: async (w) => {
        const s = await freshSession(w);
        return { path: `/api/sessions/${s.id}/cells/${s.cellId}/cancel` };
      },
    },
  ],
  "sessions/[id]/objects/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/objects` }) },
  ],
  "sessions/[id]/objects/[objectId]/route.ts": [
    {
      method: "PATCH",
      expect: EDIT,
      make: async (w) => {
        const s = await freshSession(w);
        return { path: `/api/sessions/${s.id}/objects/${s.objectId}`, body: { name: "renamed" } };
      },
    },
    {
      method: "DELETE",
      expect: EDIT,
      make: async (w) => {
        const s = await freshSession(w);
        return { path: `/api/sessions/${s.id}/objects/${s.objectId}` };
      },
    },
  ],
  "sessions/[id]/shares/route.ts": [
    { method: "GET", expect: MANAGE, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/shares` }) },
    {
      method: "POST",
      expect: MANAGE_CREATE,
      make: async (w) => ({
        path: `/api/sessions/${(await freshSession(w)).id}/shares`,
        body: { email: "admin@harbor.test.example", role: "viewer" },
      }),
    },
  ],
  "sessions/[id]/shares/[shareId]/route.ts": [
    {
      method: "DELETE",
      expect: MANAGE,
      make: async (w) => {
        const s = await freshSession(w);
        return { path: `/api/sessions/${s.id}/shares/${s.editorShareId}` };
      },
    },
  ],
  "sessions/[id]/link/route.ts": [
    // the session already has a link: publishing answers it again (200)
    { method: "POST", expect: MANAGE, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/link` }) },
    { method: "DELETE", expect: MANAGE, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/link` }) },
  ],
  "sessions/[id]/details/[detail]/route.ts": [
    {
      method: "GET",
      // The fresh session holds no large value, so whoever may read it hears 404 for a detail id
      // (as do those who may not); signed out without a link: 401. Readers fetching a detail the
      // session holds: tests/integration/robust-compute.test.ts.
      expect: [404, 404, 404, 404, 404, 404, 404, 404, 401, 404, 404],
      make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/details/00000000-0000-4000-8000-000000000000` }),
    },
  ],
  "sessions/[id]/export/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/sessions/${(await freshSession(w)).id}/export?format=latex` }) },
  ],
  "sessions/import/route.ts": [
    { method: "POST", expect: SIGNED_IN_CREATE, make: async () => ({ path: "/api/sessions/import", body: importDoc() }) },
  ],
  "teams/route.ts": [
    { method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/teams" }) },
    { method: "POST", expect: SIGNED_IN_CREATE, make: async () => ({ path: "/api/teams", body: { name: "Matrix created team" } }) },
  ],
  "teams/[id]/route.ts": [
    {
      method: "GET",
      expect: [403, 403, 403, 403, 200, 200, 200, 403, 401, 401, 403],
      make: async (w) => ({ path: `/api/teams/${await freshTeam(w)}` }),
    },
  ],
  "teams/[id]/invitations/route.ts": [
    { method: "GET", expect: TEAM_LEAD, make: async (w) => ({ path: `/api/teams/${await freshTeam(w)}/invitations` }) },
    {
      method: "POST",
      expect: [403, 403, 403, 403, 201, 403, 403, 403, 401, 401, 403],
      make: async (w) => ({ path: `/api/teams/${await freshTeam(w)}/invitations`, body: { email: uniqueEmail("matrix"), role: "member" } }),
    },
  ],
  "teams/[id]/invitations/[invitationId]/route.ts": [
    {
      method: "DELETE",
      expect: TEAM_LEAD,
      make: async (w) => {
        const teamId = await freshTeam(w);
        const token = await invitationFor(teamId, uniqueEmail("revoke"), w.ids.lead);
        const [row] = await db().select({ id: invitations.id }).from(invitations).where(eqHash(token));
        return { path: `/api/teams/${teamId}/invitations/${row!.id}` };
      },
    },
  ],
  "teams/[id]/members/[userId]/route.ts": [
    {
      method: "PATCH",
      expect: TEAM_LEAD,
      make: async (w) => ({ path: `/api/teams/${await freshTeam(w)}/members/${w.ids.guest}`, body: { role: "member" } }),
    },
    // the guest removing the guest is leaving the team, which anyone may
    {
      method: "DELETE",
      expect: [403, 403, 403, 403, 200, 403, 200, 403, 401, 401, 403],
      make: async (w) => ({ path: `/api/teams/${await freshTeam(w)}/members/${w.ids.guest}` }),
    },
  ],
  "invitations/[token]/route.ts": [
    {
      method: "GET",
      expect: SIGNED_IN,
      make: async (w) => ({ path: `/api/invitations/${await invitationFor(await freshTeam(w), uniqueEmail("peek"), w.ids.lead)}` }),
    },
  ],
  "invitations/[token]/accept/route.ts": [
    {
      method: "POST",
      // addressed to someone else: every signed-in caller is the wrong account
      expect: [403, 403, 403, 403, 403, 403, 403, 403, 401, 401, 403],
      make: async (w) => ({ path: `/api/invitations/${await invitationFor(await freshTeam(w), uniqueEmail("other"), w.ids.lead)}/accept` }),
    },
  ],
  "objects/route.ts": [{ method: "GET", expect: SIGNED_IN, make: async () => ({ path: "/api/objects" }) }],
  "objects/[objectId]/route.ts": [
    // the admin holds a viewer share of the object alone
    {
      method: "GET",
      expect: [200, 200, 200, 200, 200, 200, 200, 404, 401, 200, 200],
      make: async (w) => ({ path: `/api/objects/${(await freshSession(w)).objectId}` }),
    },
  ],
  "objects/[objectId]/shares/route.ts": [
    {
      method: "GET",
      expect: [200, 403, 403, 403, 200, 403, 403, 404, 401, 401, 403],
      make: async (w) => ({ path: `/api/objects/${(await freshSession(w)).objectId}/shares` }),
    },
    {
      method: "POST",
      expect: [201, 403, 403, 403, 201, 403, 403, 404, 401, 401, 403],
      make: async (w) => ({
        path: `/api/objects/${(await freshSession(w)).objectId}/shares`,
        body: { email: "outsider@harbor.test.example", role: "viewer" },
      }),
    },
  ],
  "objects/[objectId]/shares/[shareId]/route.ts": [
    {
      method: "DELETE",
      expect: [200, 403, 403, 403, 200, 403, 403, 404, 401, 401, 403],
      make: async (w) => {
        const s = await freshSession(w);
        return { path: `/api/objects/${s.objectId}/shares/${s.objectShareId}` };
      },
    },
  ],
  "objects/[objectId]/import/route.ts": [
    {
      method: "POST",
      expect: [201, 201, 201, 201, 201, 201, 201, 404, 401, 401, 201],
      make: async (w, role) => {
        const s = await freshSession(w);
        const actor: Actor = role === "stranger" || role === "signedOut" || role === "signedOutLink" ? "outsider" : role;
        return { path: `/api/objects/${s.objectId}/import`, body: { sessionId: await ownSession(w, actor, "matrix import target") } };
      },
    },
  ],
  // Experiments are shared exactly as their session (app/api/README.md, "Experiments").
  "experiments/route.ts": [
    // The list of one session's experiments takes its read-only link, as each experiment's own
    // routes do: a link holder, signed in or not, reads it (it was 404 / 401 while the list
    // ignored ?link=, so a link holder's console could not list the experiments it may open).
    {
      method: "GET",
      expect: READ,
      make: async (w) => ({ path: `/api/experiments?session=${(await freshSession(w)).id}` }),
    },
    {
      method: "POST",
      expect: BODY_CREATE,
      make: async (w) => ({
        path: "/api/experiments",
        body: {
          sessionId: (await freshSession(w)).id,
          source: "S := Q[a]\nsweep(monomial_ideals(S, degree = 1, max_gens = 1), I -> {c: I.codim})",
        },
      }),
    },
  ],
  "experiments/[id]/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done")).id}` }) },
  ],
  "experiments/[id]/rows/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done")).id}/rows` }) },
  ],
  "experiments/[id]/export/route.ts": [
    {
      method: "GET",
      expect: READ,
      make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done")).id}/export?format=latex` }),
    },
  ],
  "experiments/[id]/members/[index]/route.ts": [
    { method: "GET", expect: READ, make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done")).id}/members/0` }) },
  ],
  // queued (with no jobs): editors pause it
  "experiments/[id]/pause/route.ts": [
    { method: "POST", expect: EDIT, make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "queued")).id}/pause` }) },
  ],
  // done: nothing to resume
  "experiments/[id]/resume/route.ts": [
    {
      method: "POST",
      expect: EDIT_CONFLICT,
      make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done")).id}/resume` }),
    },
  ],
  // paused: editors cancel it
  "experiments/[id]/cancel/route.ts": [
    { method: "POST", expect: EDIT, make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "paused")).id}/cancel` }) },
  ],
  // no members, so running it again queues no work
  "experiments/[id]/rerun/route.ts": [
    {
      method: "POST",
      expect: EDIT_CREATE,
      make: async (w) => ({ path: `/api/experiments/${(await freshExperiment(w, "done", 0)).id}/rerun` }),
    },
  ],
  "experiments/uploads/route.ts": [
    {
      method: "POST",
      expect: BODY_CREATE,
      make: async (w) => ({
        path: "/api/experiments/uploads",
        body: { sessionId: (await freshSession(w)).id, name: "fam", format: "text", ring: "Q[x]", content: "<x>" },
      }),
    },
  ],
  "experiments/uploads/preview/route.ts": [
    {
      method: "POST",
      expect: SIGNED_IN,
      make: async () => ({ path: "/api/experiments/uploads/preview", body: { format: "text", ring: "Q[x]", content: "<x>" } }),
    },
  ],
};

function eqHash(token: string) {
  return eq(invitations.tokenHash, tokenHash(token));
}

async function routeFiles(dir = API, prefix = ""): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const rel = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) out.push(...(await routeFiles(path.join(dir, entry.name), rel)));
    else if (entry.name === "route.ts") out.push(rel);
  }
  return out.sort();
}

async function exportedMethods(file: string): Promise<string[]> {
  const text = await readFile(path.join(API, file), "utf8");
  const found = [...text.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)].map(
    (m) => m[1]!,
  );
  return [...new Set(found)].sort();
}

let world: World;

beforeAll(async () => {
  world = await makeWorld(160);
}, 60_000);
afterAll(async () => {
  await cleanUp(["matrix session", "matrix", "imported in the matrix", "matrix import target"], ["Matrix team", "Matrix created team"]);
  await closeDb();
});

function clientFor(role: Role): TestClient {
  switch (role) {
    case "signedOut":
    case "signedOutLink":
      return world.anonymous;
    case "stranger":
      return world.clients.outsider;
    default:
      return world.clients[role];
  }
}

async function send(role: Role, req: Request, linkToken: string | null): Promise<Response> {
  const client = clientFor(role);
  let p = req.path;
  if ((role === "linkHolder" || role === "signedOutLink") && linkToken)
    p += `${p.includes("?") ? "&" : "?"}link=${encodeURIComponent(linkToken)}`;
  if (req.form) {
    return client.request(p, {
      method: req.method,
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams(req.body as Record<string, string>).toString(),
    });
  }
  if (req.body !== undefined) return client.json(p, req.body, req.method);
  return client.request(p, { method: req.method });
}

describe("authorisation matrix", () => {
  it("has rows for every route file and every method it exports", async () => {
    const files = await routeFiles();
    expect(files.length).toBeGreaterThan(20);
    expect(Object.keys(MATRIX).sort()).toEqual(files);
    for (const f of files) expect(MATRIX[f]!.map((r) => r.method).sort(), f).toEqual(await exportedMethods(f));
  });

  for (const [file, rows] of Object.entries(MATRIX)) {
    for (const row of rows) {
      it(`${row.method} ${file}`, async () => {
        const got: Record<string, number> = {};
        const want: Record<string, number> = {};
        for (const [i, role] of ROLES.entries()) {
          const made = await row.make(world, role);
          // The link holder's token is the session's; look it up from the path's session.
          const token = role === "linkHolder" || role === "signedOutLink" ? await linkTokenOf(made.path) : null;
          const response = await send(role, { ...made, method: row.method }, token);
          await response.arrayBuffer();
          got[role] = response.status;
          want[role] = row.expect[i]!;
          if (response.status >= 400 && response.status !== 302) {
            const type = response.headers.get("content-type") ?? "";
            // every refusal of our routes is JSON {error: {code, message}} (next-auth's own excepted)
            if (!file.startsWith("auth/[")) expect(type, `${role} ${row.method} ${made.path}`).toMatch(/json/);
          }
        }
        expect(got).toEqual(want);
      }, 60_000);
    }
  }
});

const UUID_IN_PATH = /\/api\/(sessions|objects|experiments)\/([0-9a-f-]{36})|\/api\/experiments\?session=([0-9a-f-]{36})/;
async function linkTokenOf(p: string): Promise<string | null> {
  const m = UUID_IN_PATH.exec(p);
  if (!m) return null;
  if (m[3]) return tokenOfSession(m[3]);
  let sessionId = m[2]!;
  if (m[1] === "experiments") {
    const [e] = await db().select({ s: experiments.sessionId }).from(experiments).where(eq(experiments.id, sessionId));
    if (!e) return null;
    sessionId = e.s;
  }
  if (m[1] === "objects") {
    const [o] = await db().select({ s: namedObjects.sessionId }).from(namedObjects).where(eq(namedObjects.id, sessionId));
    if (!o) return null;
    sessionId = o.s;
  }
  return tokenOfSession(sessionId);
}

async function tokenOfSession(sessionId: string): Promise<string | null> {
  const [s] = await db().select({ t: sessions.shareToken }).from(sessions).where(eq(sessions.id, sessionId));
  return s?.t ?? null;
}
