import { NextResponse } from "next/server";
import { z } from "zod";
import { requireUser, requireUserOrLink } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/errors";
import { formatLimit, LIMIT_TABLE } from "@/lib/limits";
import { linkToken } from "@/lib/sessions/link-token";
import { cancelFromCell, createFromCell } from "@/lib/experiments/service";
import { definedNames } from "@/grammar/defined-names";
import { requireRedefinitionConsent } from "@/lib/sessions/redefine-guard";
import { runCell } from "@/lib/sessions/run-cell";
import { listCells } from "@/lib/sessions/store";
import { cellView } from "@/lib/sessions/views";

type Context = { params: Promise<{ id: string }> };

export const MAX_SOURCE_BYTES = LIMIT_TABLE.cellSourceBytes.value;

const NewCell = z
  .object({
    source: z
      .string()
      .max(MAX_SOURCE_BYTES, `a cell holds at most ${formatLimit("cellSourceBytes", MAX_SOURCE_BYTES)} of source (limit cellSourceBytes)`)
      .refine((s) => s.trim() !== "", "the cell is empty: type a statement to run"),
    /// the caller confirmed replacing names that someone else defined (lib/sessions/redefine-guard)
    redefine: z.boolean().optional(),
  })
  .strict();

export const dynamic = "force-dynamic";

export const GET = route(async (req, { params }: Context) => {
  const token = linkToken(req);
  const user = await requireUserOrLink(token);
  const { id } = await params;
  await requireSessionAccess(user, id, "read", { linkToken: token });
  return NextResponse.json({ cells: (await listCells(id)).map(cellView) });
});

export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id } = await params;
  // With the link's token a link holder is known to read the session: 403, not 404.
  await requireSessionAccess(user, id, "edit", { linkToken: linkToken(req) });
  const { source, redefine } = await readJson(req, NewCell, { limit: "cellSourceBytes", slackBytes: 1024 });
  await requireRedefinitionConsent(user, id, definedNames(source), redefine === true);
  // A long sweep in the cell becomes a background experiment, which cancelling the cell
  // cancels too (lib/experiments/README.md, "Sweeps in a cell").
  return runCell(user, id, source, { createExperiment: createFromCell, cancelExperiments: cancelFromCell });
});
