"use client";

import { useVirtualizer } from "@tanstack/react-virtual";
import { useDeferredValue, useEffect, useMemo, useRef, useState } from "react";
import useSWRInfinite from "swr/infinite";
import { EmptyState } from "@/components/ui/card";
import { fetcher } from "@/components/imports/api";
import { ItemDrawer } from "./item-drawer";
import { ItemFilters } from "./item-filters";
import { emptyFilters, type ClassInfo, type Filters, type ItemPage, type ItemRow } from "./types";

const ROW = 40;
const PAGE = 500;
const statusText: Record<string, string> = { unlabelled: "unlabelled", in_progress: "in progress", agreed: "agreed", disputed: "disputed", ruled: "ruled", control: "control" };

function query(f: Filters) {
  const p = new URLSearchParams({ sort: f.sort, dir: f.dir, limit: String(PAGE) });
  if (f.status) p.set("status", f.status);
  if (f.label) p.set("label", f.label);
  if (f.shareMin) p.set("shareMin", f.shareMin);
  if (f.shareMax) p.set("shareMax", f.shareMax);
  if (f.q.trim()) p.set("q", f.q.trim());
  return p;
}

/** The items table: cursor pages from the server, only the visible rows in the DOM. */
export function ItemsBrowser({ projectId, classes }: { projectId: number; classes: ClassInfo[] }) {
  const [filters, setFilters] = useState<Filters>(emptyFilters);
  const deferred = useDeferredValue(filters);
  const [openId, setOpenId] = useState<number | null>(null);
  const base = `/api/v1/projects/${projectId}/items`;
  const { data, size, setSize, isValidating, error } = useSWRInfinite<ItemPage>(
    (index, prev) => {
      if (prev && !prev.nextCursor) return null;
      const p = query(deferred);
      if (index > 0 && prev?.nextCursor) p.set("cursor", prev.nextCursor);
      return `${base}?${p}`;
    },
    fetcher,
    { revalidateFirstPage: false, revalidateOnFocus: false },
  );
  const rows = useMemo<ItemRow[]>(() => (data ?? []).flatMap((p) => p.items), [data]);
  const total = data?.[0]?.total ?? 0;
  const hasMore = Boolean(data?.[data.length - 1]?.nextCursor);
  const scroller = useRef<HTMLDivElement>(null);
  // Keyset pages arrive in order, so the list grows as it is scrolled (one placeholder row while more exist);
  // this also keeps the scroll height under browsers' element-height cap with a million items.
  const v = useVirtualizer({ count: hasMore ? rows.length + 1 : rows.length, getScrollElement: () => scroller.current, estimateSize: () => ROW, overscan: 12 });
  const virtual = v.getVirtualItems();
  const last = virtual[virtual.length - 1];
  useEffect(() => {
    if (last && hasMore && !isValidating && last.index >= rows.length - 40) void setSize(size + 1);
  }, [last, hasMore, isValidating, rows.length, setSize, size]);
  useEffect(() => {
    scroller.current?.scrollTo({ top: 0 });
  }, [deferred]);
  const className = (id: number | null) => classes.find((c) => c.id === id);

  return (
    <div className="space-y-4">
      <ItemFilters value={filters} onChange={setFilters} classes={classes} />
      <p className="text-xs text-ink-faint" data-testid="items-count">
        {data ? `${total.toLocaleString("en")} item${total === 1 ? "" : "s"}` : "Loading…"}
        {hasMore && data ? ` · ${rows.length.toLocaleString("en")} loaded; more load as you scroll` : ""}
      </p>
      {error ? <p className="text-sm text-alarm-700">{(error as Error).message}</p> : null}
      {data && total === 0 ? (
        <EmptyState title="No items match">Change the filters, or import items first.</EmptyState>
      ) : (
        <div className="rounded-card border border-line bg-paper-raised">
          <div className="grid grid-cols-[minmax(10rem,2fr)_8rem_8rem_7rem_6rem] gap-3 border-b border-line bg-paper-sunk px-4 py-2 text-xs font-bold uppercase tracking-wide text-ink-soft" role="row">
            <span>Id</span>
            <span>Status</span>
            <span>Label</span>
            <span>Top share</span>
            <span className="text-right">Labels</span>
          </div>
          <div ref={scroller} className="h-[65vh] overflow-y-auto" data-testid="items-scroller">
            <div style={{ height: v.getTotalSize(), position: "relative" }}>
              {virtual.map((vr) => {
                const item = rows[vr.index];
                const label = className(item?.finalClassId ?? item?.priorClassId ?? null);
                return (
                  <div
                    key={vr.key}
                    role="row"
                    data-testid="item-row"
                    className="absolute left-0 top-0 grid w-full cursor-pointer grid-cols-[minmax(10rem,2fr)_8rem_8rem_7rem_6rem] items-center gap-3 border-b border-line/60 px-4 text-sm hover:bg-pine-50"
                    style={{ height: ROW, transform: `translateY(${vr.start}px)` }}
                    onClick={() => item && setOpenId(item.id)}
                  >
                    {item ? (
                      <>
                        <span className="truncate font-mono text-xs text-ink">{item.externalId}</span>
                        <span className="text-xs text-ink-soft">{item.isControl ? "control" : statusText[item.status] ?? item.status}</span>
                        <span className="flex items-center gap-1.5 truncate text-xs">
                          {label ? <span className="h-2.5 w-2.5 shrink-0 rounded-full" style={{ background: label.colour }} /> : null}
                          {label ? `${label.name}${item.finalClassId ? "" : " (prior)"}` : "—"}
                        </span>
                        <span className="tabular-nums text-xs text-ink-soft">{item.poolTopShare === null ? "—" : `${Math.round(item.poolTopShare * 100)}%`}</span>
                        <span className="text-right tabular-nums text-xs">{item.labelCount}</span>
                      </>
                    ) : (
                      <span className="col-span-5 h-3 w-1/2 animate-pulse rounded bg-paper-sunk" />
                    )}
                  </div>
                );
              })}
            </div>
          </div>
        </div>
      )}
      {openId !== null ? <ItemDrawer projectId={projectId} itemId={openId} classes={classes} onClose={() => setOpenId(null)} /> : null}
    </div>
  );
}
