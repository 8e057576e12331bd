import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { HttpError, notFound, route } from "@/lib/http/errors";
import { requestCancel } from "@/lib/sessions/cancel-channel";
import { linkToken } from "@/lib/sessions/link-token";
import { isOrphan } from "@/lib/sessions/liveness";
import { endOrphan, getCell } from "@/lib/sessions/store";
import { cancelFromCell } from "@/lib/experiments/service";

type Context = { params: Promise<{ id: string; cell: string }> };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, cell: cellId } = await params;
  await requireSessionAccess(user, id, "edit", { linkToken: linkToken(req) });
  const cell = UUID.test(cellId) ? await getCell(id, cellId) : undefined;
  if (!cell) throw notFound("The cell");
  if (cell.status !== "running") throw new HttpError(409, "not_running", `The cell is not running (it is ${cell.status}).`);
  // A cell whose server is gone has nobody to hear the cancel: end it here, with the
  // background experiments its stored values name (what the heartbeat kept of the run).
  if (isOrphan(cell)) {
    const stopped = await cancelFromCell(cell.id, experimentIdsOf(cell));
    const also =
      stopped.length === 0
        ? ""
        : `, and so ${stopped.length === 1 ? "was its background experiment" : `were its ${stopped.length} background experiments`}`;
    await endOrphan(cell.id, "cancelled", `cancelled after the server running it had stopped${also}`);
    return NextResponse.json({ cancelled: true });
  }
  await requestCancel(cell.id);
  return NextResponse.json({ cancelled: true });
});

/// The ids of the Experiment values among a cell's stored statement results.
function experimentIdsOf(cell: { result: unknown }): string[] {
  const statements = (cell.result as { statements?: { value?: { type?: unknown; id?: unknown } }[] } | null)?.statements ?? [];
  return statements.flatMap((s) => (s.value?.type === "Experiment" && typeof s.value.id === "string" ? [s.value.id] : []));
}
