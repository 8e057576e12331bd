/// Schema round trip on the real test database: every table written and read back, and
/// the constraints that keep bad rows out.
import { afterAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { auditLog, cells, invitations, memberships, namedObjects, sessions, shares, teams, users } from "@/db/schema";
import { testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/fixtures";

testEnv("DATABASE_URL");
afterAll(() => closeDb());

// postgres.js wraps the server's error; the SQLSTATE code is on the error or its cause.
async function sqlState(promise: Promise<unknown>): Promise<string | undefined> {
  try {
    await promise;
  } catch (error) {
    const e = error as { code?: string; cause?: { code?: string } };
    return e.cause?.code ?? e.code;
  }
  return undefined;
}

async function newUser(tag: string) {
  const [u] = await db()
    .insert(users)
    .values({ email: uniqueEmail(tag), displayName: tag, passwordHash: "not-a-real-hash" })
    .returning();
  return u!;
}

describe("schema", () => {
  it("stores and reads back a session with its team, cells, objects, shares, invitation and audit entry", async () => {
    const owner = await newUser("owner");
    const reader = await newUser("reader");
    const [team] = await db()
      .insert(teams)
      .values({ slug: `t-${owner.id}`, name: "Round trip", createdBy: owner.id })
      .returning();
    await db().insert(memberships).values({ teamId: team!.id, userId: reader.id, role: "guest" });
    const [s] = await db()
      .insert(sessions)
      .values({ title: "Round trip", ownerId: owner.id, teamId: team!.id, visibility: "team", shareToken: `tok-${owner.id}` })
      .returning();
    const result = {
      kind: "betti",
      table: [
        [1, 0],
        [0, 3],
      ],
    };
    const [c] = await db()
      .insert(cells)
      .values({
        sessionId: s!.id,
        position: 0,
        source: "I = ideal(x^2, y^2)",
        status: "done",
        result,
        durationMs: 12,
        engineVersion: "0.1.0",
        createdBy: owner.id,
      })
      .returning();
    await db()
      .insert(namedObjects)
      .values({ sessionId: s!.id, ownerId: owner.id, name: "I", type: "ideal", value: { gens: ["x^2", "y^2"] }, sourceCellId: c!.id });
    await db().insert(shares).values({ sessionId: s!.id, userId: reader.id, role: "viewer", createdBy: owner.id });
    await db()
      .insert(invitations)
      .values({
        teamId: team!.id,
        email: uniqueEmail("invitee"),
        role: "member",
        tokenHash: `h-${owner.id}`,
        invitedBy: owner.id,
        expiresAt: new Date(Date.now() + 86_400_000),
      });
    await db()
      .insert(auditLog)
      .values({ event: "signup", userId: owner.id, email: owner.email, details: { via: "schema test" } });

    const [back] = await db().select().from(cells).where(eq(cells.sessionId, s!.id));
    expect(back).toMatchObject({ position: 0, status: "done", result, durationMs: 12, engineVersion: "0.1.0" });
    const [obj] = await db().select().from(namedObjects).where(eq(namedObjects.sessionId, s!.id));
    expect(obj).toMatchObject({ name: "I", type: "ideal", value: { gens: ["x^2", "y^2"] }, sourceCellId: c!.id });
    const [sess] = await db().select().from(sessions).where(eq(sessions.id, s!.id));
    expect(sess).toMatchObject({ visibility: "team", shareToken: `tok-${owner.id}`, teamId: team!.id, ownerId: owner.id });
    const [audit] = await db().select().from(auditLog).where(eq(auditLog.userId, owner.id));
    expect(audit?.details).toEqual({ via: "schema test" });

    // Deleting the session removes its cells, objects and shares with it.
    await db().delete(sessions).where(eq(sessions.id, s!.id));
    expect(await db().select().from(cells).where(eq(cells.sessionId, s!.id))).toHaveLength(0);
    expect(await db().select().from(namedObjects).where(eq(namedObjects.sessionId, s!.id))).toHaveLength(0);
    expect(await db().select().from(shares).where(eq(shares.sessionId, s!.id))).toHaveLength(0);
  });

  it("refuses a second account with the same e-mail and an e-mail that is not lower-cased", async () => {
    const u = await newUser("dup");
    expect(await sqlState(db().insert(users).values({ email: u.email, displayName: "again", passwordHash: "x" }))).toBe("23505");
    expect(await sqlState(db().insert(users).values({ email: "Upper@Case.example", displayName: "x", passwordHash: "x" }))).toBe("23514");
  });

  it("keeps cell positions and object names unique within a session", async () => {
    const owner = await newUser("unique");
    const [s] = await db().insert(sessions).values({ title: "u", ownerId: owner.id }).returning();
    await db().insert(cells).values({ sessionId: s!.id, position: 0, source: "a" });
    expect(await sqlState(db().insert(cells).values({ sessionId: s!.id, position: 0, source: "b" }))).toBe("23505");
    expect(await sqlState(db().insert(cells).values({ sessionId: s!.id, position: -1, source: "c" }))).toBe("23514");
    await db().insert(namedObjects).values({ sessionId: s!.id, ownerId: owner.id, name: "R", type: "ring", value: {} });
    expect(
      await sqlState(db().insert(namedObjects).values({ sessionId: s!.id, ownerId: owner.id, name: "R", type: "ring", value: {} })),
    ).toBe("23505");
  });

  it("rejects roles and visibilities outside their enums and inconsistent sessions and shares", async () => {
    const owner = await newUser("checks");
    expect(
      await sqlState(
        db().execute(sql`INSERT INTO users (email, display_name, password_hash, site_role) VALUES ('x@y.example', 'x', 'x', 'owner')`),
      ),
    ).toBe("22P02");
    // A link is a token, not a visibility (issue 8); a team-visible session needs a team.
    expect(await sqlState(db().execute(sql`INSERT INTO sessions (title, owner_id, visibility) VALUES ('link', ${owner.id}, 'link')`))).toBe(
      "22P02",
    );
    expect(await sqlState(db().insert(sessions).values({ title: "no team", ownerId: owner.id, visibility: "team" }))).toBe("23514");
    const [s] = await db().insert(sessions).values({ title: "shares", ownerId: owner.id }).returning();
    // A share names exactly one grantee.
    expect(await sqlState(db().insert(shares).values({ sessionId: s!.id, role: "viewer" }))).toBe("23514");
    const other = await newUser("grantee");
    await db().insert(shares).values({ sessionId: s!.id, userId: other.id, role: "viewer" });
    expect(await sqlState(db().insert(shares).values({ sessionId: s!.id, userId: other.id, role: "editor" }))).toBe("23505");
  });

  it("removes memberships with their user and keeps the audit trail with the user reference cleared", async () => {
    const u = await newUser("leaver");
    const [team] = await db()
      .insert(teams)
      .values({ slug: `leave-${u.id}`, name: "Leave" })
      .returning();
    await db().insert(memberships).values({ teamId: team!.id, userId: u.id, role: "member" });
    const [entry] = await db().insert(auditLog).values({ event: "signup", userId: u.id, email: u.email }).returning();
    await db().delete(users).where(eq(users.id, u.id));
    expect(await db().select().from(memberships).where(eq(memberships.teamId, team!.id))).toHaveLength(0);
    const [kept] = await db().select().from(auditLog).where(eq(auditLog.id, entry!.id));
    expect(kept).toMatchObject({ userId: null, email: u.email });
  });
});
