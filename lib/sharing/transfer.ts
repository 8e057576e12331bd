/// Export of a session (LaTeX, Markdown, our JSON) and import of our JSON into a new
/// session owned by the caller, in one transaction (all cells and objects or nothing).
import { asc, eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "@/db/client";
import { cells, namedObjects, sessions, users } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/types";
import { EXPORT_FORMAT, EXPORT_VERSION, ImportBody, SessionExport } from "@/lib/export/format";
import { transcriptToLatex } from "@/lib/export/latex";
import { transcriptToMarkdown } from "@/lib/export/markdown";
import { statementsOf, type Transcript, type ValueJsonLike } from "@/lib/export/transcript";
import { HttpError } from "@/lib/http/errors";
import { canRead } from "@/lib/auth/access";
import { detailIdsIn, sessionsHoldingDetails, withoutDetailsOutside } from "@/lib/sessions/details";
import { auditSharing } from "./common";

type SessionRow = typeof sessions.$inferSelect;

/// Which cells an export holds: `positions` (null: all) and whether to leave out cells
/// that ended in an error or were stopped. With a choice, only the named objects bound by
/// the chosen cells (or by no cell, such as imported copies) go with them.
export interface ExportSelection {
  positions: readonly number[] | null;
  skipErrors: boolean;
}
export const ALL_CELLS: ExportSelection = { positions: null, skipErrors: false };

async function load(session: SessionRow, selection: ExportSelection = ALL_CELLS) {
  const database = db();
  const [owner] = await database.select({ name: users.displayName }).from(users).where(eq(users.id, session.ownerId));
  const chosen = selection.positions === null ? null : new Set(selection.positions);
  // Running cells have no result yet: the export holds finished cells only.
  const cellRows = (await database.select().from(cells).where(eq(cells.sessionId, session.id)).orderBy(asc(cells.position))).filter(
    (c) =>
      (c.status === "done" ||
        (!selection.skipErrors && (c.status === "error" || c.status === "cancelled" || c.status === "interrupted"))) &&
      (chosen === null || chosen.has(c.position)),
  );
  const kept = new Set(cellRows.map((c) => c.id));
  const filtered = chosen !== null || selection.skipErrors;
  const objectRows = (
    await database.select().from(namedObjects).where(eq(namedObjects.sessionId, session.id)).orderBy(asc(namedObjects.name))
  ).filter((o) => !filtered || o.sourceCellId === null || kept.has(o.sourceCellId));
  return { ownerName: owner?.name ?? "", cellRows, objectRows };
}

export async function exportJson(session: SessionRow, selection: ExportSelection = ALL_CELLS): Promise<SessionExport> {
  const { ownerName, cellRows, objectRows } = await load(session, selection);
  const positionOf = new Map(cellRows.map((c) => [c.id, c.position]));
  return {
    format: EXPORT_FORMAT,
    version: EXPORT_VERSION,
    exportedAt: new Date().toISOString(),
    session: { title: session.title, ownerName },
    cells: cellRows.map((c) => {
      const result = c.result as { statements?: unknown[]; currentRing?: unknown } | null;
      const raw = Array.isArray(result?.statements) ? result.statements : [];
      return {
        position: c.position,
        source: c.source,
        status: c.status as "done" | "error" | "cancelled" | "interrupted",
        results: raw.map((s, i) => {
          const r = s as { statement?: number; index?: number; span?: unknown; value: ValueJsonLike };
          return {
            statement: r.statement ?? r.index ?? i,
            span: (r.span ?? null) as SessionExport["cells"][number]["results"][number]["span"],
            value: r.value,
          };
        }),
        error: (c.error ?? null) as SessionExport["cells"][number]["error"],
        currentRing: typeof result?.currentRing === "string" ? result.currentRing : null,
        durationMs: c.durationMs,
        engineVersion: c.engineVersion,
      };
    }),
    objects: objectRows.map((o) => ({
      name: o.name,
      type: o.type,
      value: o.value as ValueJsonLike,
      source: o.source,
      cell: o.sourceCellId ? (positionOf.get(o.sourceCellId) ?? null) : null,
      origin: (o.origin ?? null) as Record<string, unknown> | null,
    })),
  };
}

export async function exportText(
  session: SessionRow,
  format: "latex" | "markdown",
  selection: ExportSelection = ALL_CELLS,
): Promise<string> {
  const { ownerName, cellRows, objectRows } = await load(session, selection);
  const transcript: Transcript = {
    title: session.title,
    ownerName,
    exportedAt: new Date().toISOString(),
    cells: cellRows.map((c) => ({
      position: c.position,
      source: c.source,
      status: c.status,
      results: statementsOf(c.result),
      error: (c.error ?? null) as Transcript["cells"][number]["error"],
    })),
    objects: objectRows.map((o) => ({ name: o.name, type: o.type, value: o.value as ValueJsonLike, source: o.source })),
  };
  return format === "latex" ? transcriptToLatex(transcript) : transcriptToMarkdown(transcript);
}

function invalid(error: z.ZodError): HttpError {
  const details = error.issues.map((i) => ({ path: i.path.join(".") || "(body)", message: i.message }));
  return new HttpError(400, "invalid_export", `Not a Ringside session export: ${details[0]!.path}: ${details[0]!.message}`, details);
}

/// Validates an import body: the export itself, or `{title?, export}`.
export function parseImport(body: unknown): { doc: SessionExport; title: string } {
  const wrapped = typeof body === "object" && body !== null && "export" in body;
  const parsed = wrapped ? ImportBody.safeParse(body) : SessionExport.safeParse(body);
  if (!parsed.success) {
    if (wrapped) {
      const inner = SessionExport.safeParse((body as { export: unknown }).export);
      if (!inner.success) throw invalid(inner.error);
    }
    throw invalid(parsed.error);
  }
  const data = parsed.data as ImportBody;
  if ("export" in data) return { doc: data.export, title: data.title ?? data.export.session.title };
  return { doc: data, title: data.session.title };
}

/// An import may carry the marker of a value's detail (a summary of a large value); the detail
/// is served to whoever holds the marker, so a crafted import could name another user's
/// detail. A marker is kept only when the importer can read a session that already holds it
/// (their own export imported again, a session shared with them); the others are dropped and
/// the summary stays.
async function keepReadableDetails(user: CurrentUser, doc: SessionExport): Promise<SessionExport> {
  const ids = detailIdsIn(doc);
  const keep = new Set<string>();
  const readable = new Map<string, boolean>();
  for (const [id, sessionIds] of await sessionsHoldingDetails([...ids])) {
    for (const sessionId of sessionIds) {
      if (!readable.has(sessionId)) readable.set(sessionId, await canRead(user, sessionId));
      if (readable.get(sessionId)) {
        keep.add(id);
        break;
      }
    }
  }
  return keep.size === ids.size ? doc : withoutDetailsOutside(doc, keep);
}

export async function importSession(user: CurrentUser, given: SessionExport, title: string, address: string) {
  const importedAt = new Date().toISOString();
  const doc = await keepReadableDetails(user, given);
  return db().transaction(async (tx) => {
    const [session] = await tx.insert(sessions).values({ title, ownerId: user.id }).returning();
    const idOf = new Map<number, string>();
    const ordered = [...doc.cells].sort((a, b) => a.position - b.position);
    // Positions are renumbered 0, 1, 2, … in their order.
    for (const [n, c] of ordered.entries()) {
      const [row] = await tx
        .insert(cells)
        .values({
          sessionId: session!.id,
          position: n,
          source: c.source,
          status: c.status,
          result: { statements: c.results, currentRing: c.currentRing },
          error: c.error,
          durationMs: c.durationMs,
          engineVersion: c.engineVersion,
          createdBy: user.id,
          finishedAt: new Date(),
        })
        .returning({ id: cells.id });
      idOf.set(c.position, row!.id);
    }
    if (doc.objects.length > 0) {
      await tx.insert(namedObjects).values(
        doc.objects.map((o) => ({
          sessionId: session!.id,
          ownerId: user.id,
          name: o.name,
          type: o.type,
          value: o.value,
          source: o.source,
          sourceCellId: o.cell === null ? null : (idOf.get(o.cell) ?? null),
          origin: o.origin ?? {
            kind: "export",
            sessionTitle: doc.session.title,
            ownerName: doc.session.ownerName,
            name: o.name,
            exportedAt: doc.exportedAt,
            importedAt,
          },
        })),
      );
    }
    await auditSharing(tx, {
      event: "session_imported",
      userId: user.id,
      email: user.email,
      address,
      details: { sessionId: session!.id, fromTitle: doc.session.title, cells: doc.cells.length, objects: doc.objects.length },
    });
    return { id: session!.id, title: session!.title, cells: doc.cells.length, objects: doc.objects.length };
  });
}
