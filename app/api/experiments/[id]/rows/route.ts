import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { z } from "zod";
import { LIMIT_TABLE } from "@/lib/limits";
import { HttpError } from "@/lib/http/errors";
import { requireExperimentAccess } from "@/lib/experiments/access";
import { readRows } from "@/lib/experiments/store";
import { FIXED_COLUMNS, probeColumns, rowView } from "@/lib/experiments/views";

type Context = { params: Promise<{ id: string }> };

const Query = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce
    .number()
    .int()
    .min(1)
    .max(LIMIT_TABLE.pageRows.value, `at most ${LIMIT_TABLE.pageRows.value} rows per request (limit pageRows)`)
    .default(100),
  sort: z.string().default("index"),
  order: z.enum(["asc", "desc"]).default("asc"),
  status: z
    .string()
    .transform((s) => s.split(",").filter(Boolean))
    .pipe(z.array(z.enum(["ok", "error", "limit", "cancelled"])))
    .optional(),
  where: z.array(z.string().regex(/^[^:]+:(eq|ne|lt|le|gt|ge):.*$/, "where is column:op:value, op one of eq ne lt le gt ge")).default([]),
});

/// GET /api/experiments/:id/rows?offset&limit&sort&order&status=ok,error&where=col:op:value
/// (where may repeat): rows paged, sorted and filtered by the database.
export const GET = experimentRoute(async (req, { params }: Context) => {
  const { id } = await params;
  const { experiment } = await requireExperimentAccess(req, id, "read");
  const sp = new URL(req.url).searchParams;
  const parsed = Query.safeParse({ ...Object.fromEntries(sp), where: sp.getAll("where") });
  if (!parsed.success) {
    const i = parsed.error.issues[0]!;
    throw new HttpError(400, "invalid_query", `Invalid ${i.path.join(".") || "query"}: ${i.message}`);
  }
  const q = parsed.data;
  const probe = probeColumns(experiment);
  const known = new Set<string>([...FIXED_COLUMNS, "worker", ...probe]);
  if (!known.has(q.sort)) throw new HttpError(400, "invalid_query", `Cannot sort by ${q.sort}; the columns are ${[...known].join(", ")}.`);
  const where = q.where.map((w) => {
    const [column, op, ...rest] = w.split(":");
    if (!probe.includes(column))
      throw new HttpError(
        400,
        "invalid_query",
        `Cannot filter on ${column}; filter the probe's columns (${probe.join(", ") || "none yet"}) with where, the status with status.`,
      );
    return { column, op: op as "eq", value: rest.join(":") };
  });
  const { rows, matched } = await readRows(experiment, {
    offset: q.offset,
    limit: q.limit,
    sort: q.sort,
    order: q.order,
    status: q.status,
    where,
  });
  return NextResponse.json({
    columns: [...FIXED_COLUMNS, ...probe],
    rows: rows.map((r) => rowView(experiment, r)),
    matched,
    offset: q.offset,
    limit: q.limit,
  });
});
