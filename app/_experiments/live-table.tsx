"use client";
/// The live table of an experiment, built on TanStack Table (headless): rows appear while
/// the experiment runs; every column sorts and filters; columns can be hidden; a row
/// expands to its member and full result. A small experiment (at most CLIENT_ROWS members)
/// is read whole and sorted and filtered in the browser; a larger one is sorted, filtered
/// and paged by the database through the API (`sort`, `order`, `status`, `where`, `offset`).
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ColumnFiltersState,
  type FilterFn,
  type SortingFn,
  type SortingState,
  type VisibilityState,
} from "@tanstack/react-table";
import { Fragment, useMemo, useState } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { buttonQuiet, buttonSecondary, focusRing, panelHeading } from "@/app/_console/views/styles";
import { rowsUrl } from "./api";
import { cellNumber, cellText } from "./data/cells";
import { parseFilter, rowPasses, whereParam } from "./data/filters";
import { MemberDetail } from "./member-detail";
import { RowStatusBadge, StatusChips } from "./status-chips";
import { FIXED_COLUMNS, type Experiment, type Row, type RowsPage, type RowStatus } from "./types";

/// Experiments up to this size are read whole and sorted/filtered in the browser.
export const CLIENT_ROWS = 1000;
const PAGE_SIZE = 50;

const byCell: SortingFn<Row> = (a, b, column) => {
  const x = cellNumber(a.original, column);
  const y = cellNumber(b.original, column);
  if (x !== null && y !== null) return x - y;
  if (x !== null) return -1;
  if (y !== null) return 1;
  return cellText(a.original, column).localeCompare(cellText(b.original, column));
};

const byFilter: FilterFn<Row> = (row, column, value) => {
  if (column === "status" && Array.isArray(value)) return value.length === 0 || value.includes(row.original.status);
  const f = parseFilter(String(value ?? ""));
  return f === null || rowPasses(row.original, column, f);
};

const inputClass = `w-full min-w-[4rem] rounded border border-ink/15 bg-white px-1.5 py-0.5 font-mono text-xs font-normal text-ink placeholder:text-ink/35 dark:border-paper/15 dark:bg-night dark:text-paper dark:placeholder:text-paper/35 ${focusRing}`;

export function LiveTable({
  experiment,
  link,
  canEdit,
  allRows,
}: {
  experiment: Experiment;
  link: string | null;
  canEdit: boolean;
  /// every row so far, when the experiment is small enough to be read whole
  allRows: { rows: readonly Row[] | undefined; error: unknown };
}) {
  const serverSide = experiment.total > CLIENT_ROWS;
  const [sorting, setSorting] = useState<SortingState>([{ id: "index", desc: false }]);
  const [filters, setFilters] = useState<Record<string, string>>({});
  const [statuses, setStatuses] = useState<ReadonlySet<RowStatus>>(new Set());
  const [visibility, setVisibility] = useState<VisibilityState>({});
  const [expanded, setExpanded] = useState<number | null>(null);
  const [pageIndex, setPageIndex] = useState(0);
  const columns = experiment.columns;
  const probe = columns.filter((c) => !(FIXED_COLUMNS as readonly string[]).includes(c));

  // Server mode: one page of rows as the database sorted and filtered them.
  const sort = sorting[0] ?? { id: "index", desc: false };
  const where = probe.flatMap((c) => {
    const f = parseFilter(filters[c] ?? "");
    return f ? [whereParam(c, f)] : [];
  });
  const serverKey = serverSide
    ? rowsUrl(
        experiment.id,
        { offset: pageIndex * PAGE_SIZE, limit: PAGE_SIZE, sort: sort.id, order: sort.desc ? "desc" : "asc", status: [...statuses], where },
        link,
      )
    : null;
  // the finished count in the key reads the page again as rows arrive, and once more at the end
  const page = useSWR<RowsPage>(serverKey ? [serverKey, experiment.done] : null, ([url]: [string, number]) => fetchJson<RowsPage>(url), {
    keepPreviousData: true,
  });

  const data = useMemo(() => [...(serverSide ? (page.data?.rows ?? []) : (allRows.rows ?? []))], [serverSide, page.data, allRows.rows]);
  const columnFilters: ColumnFiltersState = useMemo(
    () =>
      serverSide
        ? []
        : [
            ...Object.entries(filters)
              .filter(([, v]) => v.trim() !== "")
              .map(([id, value]) => ({ id, value })),
            ...(statuses.size ? [{ id: "status", value: [...statuses] }] : []),
          ],
    [serverSide, filters, statuses],
  );

  const defs = useMemo<ColumnDef<Row>[]>(
    () =>
      columns.map((c) => ({
        id: c,
        header: c,
        accessorFn: (r: Row) => cellText(r, c),
        sortingFn: byCell,
        filterFn: byFilter,
        enableHiding: c !== "index",
      })),
    [columns],
  );

  const table = useReactTable({
    data,
    columns: defs,
    getRowId: (r) => String(r.index),
    state: { sorting, columnFilters, columnVisibility: visibility, pagination: { pageIndex, pageSize: PAGE_SIZE } },
    onSortingChange: (u) => {
      setSorting(u);
      setPageIndex(0);
    },
    onColumnVisibilityChange: setVisibility,
    onPaginationChange: (u) =>
      setPageIndex((p) => (typeof u === "function" ? u({ pageIndex: p, pageSize: PAGE_SIZE }).pageIndex : u.pageIndex)),
    getCoreRowModel: getCoreRowModel(),
    manualSorting: serverSide,
    manualFiltering: serverSide,
    manualPagination: serverSide,
    rowCount: serverSide ? (page.data?.matched ?? 0) : undefined,
    getSortedRowModel: serverSide ? undefined : getSortedRowModel(),
    getFilteredRowModel: serverSide ? undefined : getFilteredRowModel(),
    getPaginationRowModel: serverSide ? undefined : getPaginationRowModel(),
    enableSortingRemoval: false,
    autoResetPageIndex: false,
  });

  const matched = serverSide ? (page.data?.matched ?? 0) : table.getFilteredRowModel().rows.length;
  const pageCount = Math.max(1, Math.ceil(matched / PAGE_SIZE));
  const shownColumns = table.getVisibleLeafColumns().length;
  const error = serverSide ? page.error : allRows.error;
  const toggleStatus = (s: RowStatus) => {
    setStatuses((old) => {
      const next = new Set(old);
      if (next.has(s)) next.delete(s);
      else next.add(s);
      return next;
    });
    setPageIndex(0);
  };
  const setFilter = (c: string, v: string) => {
    setFilters((f) => ({ ...f, [c]: v }));
    setPageIndex(0);
  };
  const filterable = (c: string) => !serverSide || probe.includes(c);

  return (
    <section aria-label="Rows" className="flex min-w-0 flex-col gap-2">
      <div className="flex flex-wrap items-center gap-3">
        <StatusChips counts={experiment.progress.byStatus} chosen={statuses} onToggle={toggleStatus} />
        <span className="text-sm text-ink-soft dark:text-paper/70" data-testid="rows-matched" aria-live="polite">
          {matched} of {Math.max(experiment.done, serverSide ? 0 : data.length)} rows
          {experiment.done < experiment.total ? ` (${experiment.total} members)` : ""}
          {serverSide ? " · sorted and filtered by the database" : ""}
        </span>
        <details className="relative ml-auto">
          <summary className={`${buttonSecondary} cursor-pointer list-none`}>Columns</summary>
          <fieldset className="absolute right-0 z-20 mt-1 flex max-h-72 w-56 flex-col gap-1 overflow-y-auto rounded-md border border-ink/20 bg-white p-2 shadow-lg dark:border-paper/20 dark:bg-night-panel">
            <legend className="sr-only">Columns shown</legend>
            {table.getAllLeafColumns().map((col) => (
              <label key={col.id} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={col.getIsVisible()}
                  disabled={!col.getCanHide()}
                  onChange={col.getToggleVisibilityHandler()}
                />
                <span className="font-mono">{col.id}</span>
              </label>
            ))}
          </fieldset>
        </details>
      </div>
      {error !== undefined && error !== null && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300">
          {messageOf(error)}
        </p>
      )}
      <div className="min-w-0 overflow-x-auto rounded-md border border-ink/10 dark:border-paper/10">
        <table className="w-full border-collapse text-sm" data-testid="experiment-table" aria-rowcount={matched}>
          <thead className="bg-paper-deep/60 dark:bg-night-panel">
            {table.getHeaderGroups().map((g) => (
              <Fragment key={g.id}>
                <tr>
                  <th scope="col" className="w-8 px-1">
                    <span className="sr-only">Expand</span>
                  </th>
                  {g.headers.map((h) => {
                    const dir = h.column.getIsSorted();
                    return (
                      <th
                        key={h.id}
                        scope="col"
                        aria-sort={dir === "asc" ? "ascending" : dir === "desc" ? "descending" : "none"}
                        className="whitespace-nowrap px-2 pt-1.5 text-left font-semibold"
                      >
                        <button
                          type="button"
                          className={`inline-flex items-center gap-1 rounded ${focusRing}`}
                          onClick={h.column.getToggleSortingHandler()}
                          aria-label={`Sort by ${h.column.id}`}
                          title={`Sort by ${h.column.id}`}
                        >
                          <span className="font-mono">{flexRender(h.column.columnDef.header, h.getContext())}</span>
                          <span aria-hidden className="text-signal">
                            {dir === "asc" ? "▲" : dir === "desc" ? "▼" : "·"}
                          </span>
                        </button>
                      </th>
                    );
                  })}
                </tr>
                <tr>
                  <th className="px-1 pb-1.5" />
                  {g.headers.map((h) => (
                    <th key={h.id} className="px-2 pb-1.5 text-left">
                      {h.column.id === "status" ? (
                        <span className="text-xs font-normal text-ink-soft dark:text-paper/60">chips above</span>
                      ) : filterable(h.column.id) ? (
                        <input
                          className={inputClass}
                          aria-label={`Filter ${h.column.id}`}
                          placeholder={serverSide ? "= 3, > 2" : "3, > 2, text"}
                          title="A number or text; or an operator first: = != < <= > >="
                          value={filters[h.column.id] ?? ""}
                          onChange={(e) => setFilter(h.column.id, e.target.value)}
                        />
                      ) : (
                        <span
                          className="text-xs font-normal text-ink-soft dark:text-paper/60"
                          title="The API filters a large experiment on the probe's columns and the status"
                        >
                          —
                        </span>
                      )}
                    </th>
                  ))}
                </tr>
              </Fragment>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((r) => {
              const open = expanded === r.original.index;
              return (
                <Fragment key={r.id}>
                  <tr
                    className="border-t border-ink/10 hover:bg-paper-deep/40 dark:border-paper/10 dark:hover:bg-night-line/50"
                    data-row-index={r.original.index}
                  >
                    <td className="px-1 align-top">
                      <button
                        type="button"
                        className={buttonQuiet}
                        aria-expanded={open}
                        aria-label={`${open ? "Close" : "Open"} member ${r.original.index}`}
                        onClick={() => setExpanded(open ? null : r.original.index)}
                      >
                        {open ? "▾" : "▸"}
                      </button>
                    </td>
                    {r.getVisibleCells().map((cell) => (
                      <td
                        key={cell.id}
                        className={`px-2 py-1 align-top ${cell.column.id === "label" ? "max-w-[22rem] truncate font-mono text-xs" : "font-mono"}`}
                        title={cell.column.id === "label" ? r.original.label : undefined}
                      >
                        {cell.column.id === "status" ? <RowStatusBadge status={r.original.status} /> : cellText(r.original, cell.column.id)}
                      </td>
                    ))}
                  </tr>
                  {open && (
                    <tr className="bg-paper-deep/30 dark:bg-night-panel/60">
                      <td colSpan={shownColumns + 1}>
                        <MemberDetail experiment={experiment} row={r.original} link={link} canEdit={canEdit} />
                      </td>
                    </tr>
                  )}
                </Fragment>
              );
            })}
            {data.length === 0 && (
              <tr>
                <td colSpan={shownColumns + 1} className="px-3 py-4 text-sm text-ink-soft dark:text-paper/70">
                  {experiment.done === 0 ? "No rows yet: they appear here as members finish." : "No row matches the filters."}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {pageCount > 1 && (
        <nav aria-label="Pages of rows" className="flex items-center gap-2 text-sm">
          <button
            type="button"
            className={buttonSecondary}
            disabled={pageIndex === 0}
            onClick={() => setPageIndex((p) => Math.max(0, p - 1))}
          >
            Previous
          </button>
          <span className={panelHeading}>
            page {pageIndex + 1} of {pageCount}
          </span>
          <button
            type="button"
            className={buttonSecondary}
            disabled={pageIndex + 1 >= pageCount}
            onClick={() => setPageIndex((p) => p + 1)}
          >
            Next
          </button>
        </nav>
      )}
    </section>
  );
}
