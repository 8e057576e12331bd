"use client";
/// The transcript: the session's stored cells, the cell running now, the welcome of an
/// empty session, and load errors in words. It follows the newest output.
import { useEffect, useMemo, useRef, type ReactNode } from "react";
import type { GuidedExample } from "@/lib/examples/tour";
import type { Cell, NamedObject } from "@/lib/wire/reading";
import type { RunningCell } from "../state/running-cell";
import { CellErrorBoundary } from "./cell-error-boundary";
import { CellView, RunningCellView } from "./cell-view";
import { focusRing } from "./styles";
import { EmptySessionWelcome } from "./tour";

export function Transcript(props: {
  /// the session's named objects: values name their ring by them (S, not R)
  objects?: readonly NamedObject[] | undefined;
  cells: readonly Cell[] | undefined;
  running: RunningCell | null;
  /// no session is open and the visitor has none yet
  noSessions: boolean;
  canEdit: boolean;
  sessionError: string | null;
  cellsError: string | null;
  onInsertExample: (e: GuidedExample) => void;
  onOpenTour: () => void;
  onCancel: () => void;
  /// drawn under a stored cell (the experiments room's links and "Run as an experiment")
  cellFooter?: (cell: Cell) => ReactNode;
  /// where the whole of a value stored as a summary is fetched (the open session's details)
  detailAddress?: (detailId: string) => string;
}) {
  const { cells, running, noSessions, canEdit, sessionError, cellsError, onInsertExample, onOpenTour, onCancel } = props;
  const end = useRef<HTMLDivElement>(null);
  const context = useMemo(
    () => ({ objects: props.objects ?? [], detailAddress: props.detailAddress }),
    [props.objects, props.detailAddress],
  );
  useEffect(() => {
    end.current?.scrollIntoView({ block: "end" });
  }, [cells?.length, running?.results.length, running?.status, running?.partialBetti.length]);

  const shownCells = (cells ?? []).filter((c) => !(running && c.id === running.cellId));
  const empty = cells !== undefined && cells.length === 0 && !running;
  return (
    <section aria-label="Transcript" tabIndex={0} className={`min-h-0 flex-1 overflow-y-auto px-4 ${focusRing}`}>
      {sessionError && (
        <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">
          {sessionError}
        </p>
      )}
      {cellsError && !sessionError && (
        <p role="alert" className="py-3 text-sm text-red-700 dark:text-red-300">
          {cellsError}
        </p>
      )}
      {empty && <EmptySessionWelcome onInsert={onInsertExample} onOpenTour={onOpenTour} canRun={canEdit} />}
      {noSessions && <EmptySessionWelcome onInsert={onInsertExample} onOpenTour={onOpenTour} canRun />}
      {shownCells.map((c) => (
        <CellErrorBoundary key={c.id} position={c.position} source={c.source}>
          <CellView cell={c} context={context} footer={props.cellFooter?.(c)} />
        </CellErrorBoundary>
      ))}
      {running && <RunningCellView cell={running} onCancel={onCancel} context={context} />}
      <div ref={end} />
    </section>
  );
}
