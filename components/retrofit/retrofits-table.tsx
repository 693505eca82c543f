"use client";
// The retrofits table. Sorting, filters, search and pages are done by the
// server (/api/v1/retrofits); TanStack Table only renders and reports sort clicks.
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import type { RevisionState } from "@/db/schema";
import { STAGE_KINDS } from "@/lib/engine";
import { fetchJson } from "@/lib/client/fetch-json";
import type { RetrofitListItem } from "@/lib/retrofits/list";
import { STATE_WORDS } from "@/lib/review/words";
import { StateBadge } from "@/components/review/state-badge";

type ListResponse = {
  items: RetrofitListItem[];
  total: number;
  page: number;
  pageSize: number;
  sites: string[];
};

const KIND_LABEL = Object.fromEntries(STAGE_KINDS.map((k) => [k.kind, k.label]));
const col = createColumnHelper<RetrofitListItem>();

export function RetrofitsTable({ canEdit }: { canEdit: boolean }) {
  const [q, setQ] = useState("");
  const [site, setSite] = useState("");
  const [kind, setKind] = useState("");
  const [state, setState] = useState("");
  const [archived, setArchived] = useState("exclude");
  const [sorting, setSorting] = useState<SortingState>([{ id: "updatedAt", desc: true }]);
  const [page, setPage] = useState(1);
  const pageSize = 20;

  const url = useMemo(() => {
    const p = new URLSearchParams({ page: String(page), pageSize: String(pageSize), archived });
    if (q.trim()) p.set("q", q.trim());
    if (site) p.set("site", site);
    if (kind) p.set("kind", kind);
    if (state) p.set("state", state);
    if (sorting[0]) {
      p.set("sort", sorting[0].id);
      p.set("dir", sorting[0].desc ? "desc" : "asc");
    }
    return `/api/v1/retrofits?${p}`;
  }, [q, site, kind, state, archived, sorting, page]);

  const { data, error, isLoading, mutate } = useSWR<ListResponse>(url, { keepPreviousData: true });
  const [archiveError, setArchiveError] = useState<string | null>(null);

  async function archive(item: RetrofitListItem) {
    if (
      !window.confirm(
        `Archive "${item.name}"? It stays readable with its revisions but can no longer be edited.`,
      )
    )
      return;
    setArchiveError(null);
    try {
      await fetchJson(`/api/v1/retrofits/${item.id}`, { method: "DELETE" });
      await mutate();
    } catch (e) {
      setArchiveError(e instanceof Error ? e.message : String(e));
    }
  }

  const columns = useMemo(
    () => [
      col.accessor("name", {
        header: "Name",
        cell: (c) => (
          <Link
            className="font-medium underline-offset-2 hover:underline"
            href={`/retrofits/${c.row.original.id}`}
          >
            {c.getValue()}
          </Link>
        ),
      }),
      col.accessor("site", { header: "Site" }),
      col.accessor("assetTag", {
        header: "Asset tag",
        cell: (c) => <span className="num">{c.getValue()}</span>,
      }),
      col.accessor("kind", {
        header: "Stage",
        cell: (c) => (c.getValue() ? KIND_LABEL[c.getValue()!] : "not entered"),
      }),
      col.accessor("latest", {
        id: "state",
        header: "Latest revision",
        cell: (c) => {
          const l = c.getValue();
          return l ? (
            <span className="flex items-center gap-2">
              <span className="num">r{l.number}</span>
              <StateBadge state={l.state} />
            </span>
          ) : (
            <span className="text-ink-muted">none yet</span>
          );
        },
      }),
      col.accessor("updatedAt", {
        header: "Updated",
        cell: (c) => <span className="num">{c.getValue().slice(0, 10)}</span>,
      }),
      col.display({
        id: "actions",
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) =>
          c.row.original.archivedAt ? (
            <span className="text-xs text-ink-muted">archived</span>
          ) : canEdit ? (
            <button type="button" className="btn text-xs" onClick={() => archive(c.row.original)}>
              Archive
            </button>
          ) : null,
      }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [canEdit],
  );

  // TanStack Table manages its own memoisation; the compiler skipping this hook is expected.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    onSortingChange: (s) => {
      setSorting(s);
      setPage(1);
    },
    getCoreRowModel: getCoreRowModel(),
  });

  const total = data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const filtered = Boolean(q || site || kind || state || archived !== "exclude");
  const reset = (fn: (v: string) => void) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    fn(e.target.value);
    setPage(1);
  };

  return (
    <div className="space-y-3">
      <form className="grid gap-3 sm:grid-cols-5" role="search" onSubmit={(e) => e.preventDefault()}>
        <div className="sm:col-span-2">
          <label className="field-label" htmlFor="rf-q">
            Search
          </label>
          <input
            id="rf-q"
            className="input"
            value={q}
            onChange={reset(setQ)}
            placeholder="name, asset tag, board"
          />
        </div>
        <div>
          <label className="field-label" htmlFor="rf-site">
            Site
          </label>
          <select id="rf-site" className="input" value={site} onChange={reset(setSite)}>
            <option value="">All sites</option>
            {data?.sites.map((s) => (
              <option key={s}>{s}</option>
            ))}
          </select>
        </div>
        <div>
          <label className="field-label" htmlFor="rf-kind">
            Stage kind
          </label>
          <select id="rf-kind" className="input" value={kind} onChange={reset(setKind)}>
            <option value="">All kinds</option>
            {STAGE_KINDS.map((k) => (
              <option key={k.kind} value={k.kind}>
                {k.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label className="field-label" htmlFor="rf-state">
            Latest revision
          </label>
          <select id="rf-state" className="input" value={state} onChange={reset(setState)}>
            <option value="">Any state</option>
            <option value="none">No revision yet</option>
            {(Object.keys(STATE_WORDS) as RevisionState[]).map((s) => (
              <option key={s} value={s}>
                {STATE_WORDS[s]}
              </option>
            ))}
          </select>
        </div>
        <div className="sm:col-span-5 flex items-center gap-2 text-sm">
          <label htmlFor="rf-archived" className="text-ink-soft">
            Archived:
          </label>
          <select id="rf-archived" className="input w-auto" value={archived} onChange={reset(setArchived)}>
            <option value="exclude">hidden</option>
            <option value="include">shown</option>
            <option value="only">only archived</option>
          </select>
        </div>
      </form>

      {error && (
        <p role="alert" className="field-error">
          Could not load the retrofits: {error.message} Reload the page to try again.
        </p>
      )}
      {archiveError && (
        <p role="alert" className="field-error">
          Archive failed: {archiveError}
        </p>
      )}

      <div className="overflow-x-auto">
        <table className="table-dense" aria-busy={isLoading}>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sortable = h.column.id !== "actions";
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      aria-sort={dir === "asc" ? "ascending" : dir === "desc" ? "descending" : "none"}
                    >
                      {sortable ? (
                        <button
                          type="button"
                          className="font-medium"
                          onClick={h.column.getToggleSortingHandler()}
                        >
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{dir === "asc" ? " ▲" : dir === "desc" ? " ▼" : ""}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {isLoading && !data && <p className="text-sm text-ink-soft">Loading retrofits…</p>}
      {data && total === 0 && (
        <div className="panel text-sm">
          {filtered ? (
            <p>No retrofit matches these filters. Clear the search or pick another site, kind or state.</p>
          ) : (
            <p>
              No retrofits yet.{" "}
              {canEdit ? (
                <>
                  <Link href="/retrofits/new" className="underline">
                    Create the first one
                  </Link>{" "}
                  for an old timing stage: enter its asset facts, then its component values.
                </>
              ) : (
                "An engineer creates them; ask one to start."
              )}
            </p>
          )}
        </div>
      )}

      <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
        <button type="button" className="btn" disabled={page <= 1} onClick={() => setPage(page - 1)}>
          Previous
        </button>
        <span className="num">
          page {page} of {pages} · {total} retrofit{total === 1 ? "" : "s"}
        </span>
        <button type="button" className="btn" disabled={page >= pages} onClick={() => setPage(page + 1)}>
          Next
        </button>
      </nav>
    </div>
  );
}
