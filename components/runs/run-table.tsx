"use client";
// The study's saved runs as a table: sortable by any column header, filtered by text (variant or
// who ran it), by status and by review state; each row opens its saved run.
import Link from "next/link";
import { useMemo, useState } from "react";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { ReviewStateBadge } from "@/components/review/review-state-badge";
import { formatWhen } from "@/lib/client/format";
import type { RunListItem } from "@/lib/http/api-types";
import { reviewStateLabels } from "@/lib/review/review-states";
import { RunStatusBadge } from "./run-status-badge";
import {
  formatGrid,
  formatLevel,
  formatWallTime,
  matchesRunFilter,
  runStatusLabels,
  toRunTableRow,
  type RunReviewFilter,
  type RunStatusFilter,
  type RunTableFilter,
  type RunTableRow,
} from "./run-table-model";

const column = createColumnHelper<RunTableRow>();

type FigureKey = "wallSeconds" | "cells" | "warningCount" | "loudestPeakLevelDb";

/** A number column whose runs without figures sort last in either direction. */
function figureColumn(key: FigureKey, header: string, format: (row: RunTableRow) => React.ReactNode) {
  return column.accessor((row) => row[key] ?? undefined, {
    id: key,
    header,
    sortingFn: "basic",
    sortUndefined: "last",
    cell: (info) => format(info.row.original),
    meta: { numeric: true },
  });
}

export function RunTable({ runs, studyId }: { runs: RunListItem[]; studyId: string }) {
  const rows = useMemo(() => runs.map(toRunTableRow), [runs]);
  const [sorting, setSorting] = useState<SortingState>([{ id: "createdAt", desc: true }]);
  const [filter, setFilter] = useState<RunTableFilter>({ text: "", status: "all", review: "all" });
  const href = (row: RunTableRow) => `/studies/${studyId}/runs/${row.id}`;

  const columns = useMemo(
    () => [
      column.accessor("variant", {
        header: "Variant",
        cell: (info) => (
          <Link href={href(info.row.original)} className="font-medium text-ink hover:text-tide-700 hover:underline">
            {info.row.original.sceneName} <span className="font-normal text-muted">v{info.row.original.sceneVersion}</span>
          </Link>
        ),
      }),
      column.accessor("status", { header: "Status", cell: (info) => <RunStatusBadge status={info.getValue()} /> }),
      column.accessor("reviewRank", {
        id: "review",
        header: "Review",
        cell: (info) => {
          const row = info.row.original;
          return (
            <span title={row.signedOffBy ? `Signed off by ${row.signedOffBy}${row.signOffIsOlder ? ", for an older version of the scene" : ""}` : undefined}>
              <ReviewStateBadge state={row.reviewState} older={row.signOffIsOlder} />
            </span>
          );
        },
      }),
      column.accessor("who", { header: "Who" }),
      column.accessor("createdAtMs", {
        id: "createdAt",
        header: "When",
        cell: (info) => <time dateTime={info.row.original.createdAt} title={new Date(info.row.original.createdAt).toLocaleString("en-GB")}>{formatWhen(info.row.original.createdAt)}</time>,
      }),
      figureColumn("wallSeconds", "Wall time", (row) => formatWallTime(row.wallSeconds)),
      figureColumn("cells", "Grid", (row) => {
        // Two short lines keep the table narrow enough for the notebook column.
        const [cells, spacing] = formatGrid(row.cells, row.cellSize).split(", ");
        return spacing ? (
          <>
            {cells}
            <span className="block text-[11px] text-muted">{spacing}</span>
          </>
        ) : (
          cells
        );
      }),
      figureColumn("warningCount", "Warnings", (row) => (row.warningCount === null ? "–" : String(row.warningCount))),
      figureColumn("loudestPeakLevelDb", "Loudest peak", (row) => formatLevel(row.loudestPeakLevelDb)),
      column.display({
        id: "report",
        header: "Report",
        cell: (info) => (
          <Link href={`${href(info.row.original)}/report`} className="text-tide-700 hover:underline">
            Print
          </Link>
        ),
      }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps -- href only reads studyId
    [studyId],
  );

  // eslint-disable-next-line react-hooks/incompatible-library -- the table instance is used only in this render
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    globalFilterFn: (row, _columnId, value: RunTableFilter) => matchesRunFilter(row.original, value),
    getColumnCanGlobalFilter: () => true,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (row) => row.id,
  });
  const shown = table.getRowModel().rows;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          <span className="sr-only">Filter runs by variant or who ran them</span>
          <input
            type="search"
            value={filter.text}
            onChange={(event) => setFilter((previous) => ({ ...previous, text: event.target.value }))}
            placeholder="Filter by variant or person"
            className="h-8 w-64 rounded-md border border-rule-strong bg-panel px-2.5 text-sm text-ink placeholder:text-muted focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20"
          />
        </label>
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          Status
          <select
            value={filter.status}
            onChange={(event) => setFilter((previous) => ({ ...previous, status: event.target.value as RunStatusFilter }))}
            className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-sm text-ink"
          >
            <option value="all">All</option>
            {Object.entries(runStatusLabels).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          Review
          <select
            value={filter.review ?? "all"}
            onChange={(event) => setFilter((previous) => ({ ...previous, review: event.target.value as RunReviewFilter }))}
            className="h-8 rounded-md border border-rule-strong bg-panel px-2 text-sm text-ink"
          >
            <option value="all">All</option>
            {Object.entries(reviewStateLabels).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <span className="ml-auto text-xs text-muted" aria-live="polite">
          {shown.length === rows.length ? `${rows.length} ${rows.length === 1 ? "run" : "runs"}` : `${shown.length} of ${rows.length} runs`}
        </span>
      </div>
      <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
        <table className="w-full text-sm" aria-label="Saved runs">
          <thead className="border-b border-rule bg-paper/70 text-left text-xs text-muted">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"} className={`px-2.5 py-2 font-medium ${numeric ? "text-right" : ""}`}>
                      <button type="button" onClick={header.column.getToggleSortingHandler()} title={header.column.id === "loudestPeakLevelDb" ? "The largest peak level at any receiver, dB re 20 µPa" : undefined} className={`inline-flex items-center gap-1 whitespace-nowrap hover:text-ink ${sorted ? "text-ink" : ""}`}>
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden className="w-3 text-[10px]">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {shown.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-sm text-muted">
                  No run matches this filter.
                </td>
              </tr>
            ) : (
              shown.map((row) => (
                <tr key={row.id} data-testid="run-row" className="border-b border-rule last:border-0 hover:bg-paper/60">
                  {row.getVisibleCells().map((cell) => {
                    const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                    return (
                      <td key={cell.id} className={`whitespace-nowrap px-2.5 py-2 ${numeric ? "tabular text-right font-mono text-[13px]" : "text-ink-soft"}`}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    );
                  })}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
