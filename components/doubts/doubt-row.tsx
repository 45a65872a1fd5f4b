"use client";

import { Button } from "@/components/ui/button";
import type { DoubtRow as Doubt } from "@/lib/suggest/doubts";
import { ClassChip, ShareBar, type ClassBrief } from "./share-bar";

export type ItemBrief = { externalId: string; fields: Record<string, unknown>; status: string; finalClassId: number | null };

function fieldLine(fields: Record<string, unknown>) {
  return Object.entries(fields)
    .filter(([, v]) => v !== null && typeof v !== "object")
    .slice(0, 5)
    .map(([k, v]) => `${k} ${typeof v === "number" ? Number(v.toFixed(3)) : String(v).slice(0, 24)}`)
    .join(" · ");
}

/** One doubted item: its label, the share its neighbours give that label, the neighbours, and the way to Disputes. */
export function DoubtCard({ rank, doubt, item, items, classes, inDisputes, sending, onSend }: {
  rank: number;
  doubt: Doubt;
  item: ItemBrief | undefined;
  items: Record<string, ItemBrief>;
  classes: ClassBrief[];
  inDisputes: boolean;
  sending: boolean;
  onSend: () => void;
}) {
  const byId = new Map(classes.map((c) => [c.id, c]));
  const own = byId.get(doubt.classId);
  const top = doubt.topClassId === null ? undefined : byId.get(doubt.topClassId);
  return (
    <li className="grid gap-4 rounded-card border border-line bg-paper-raised p-4 shadow-card md:grid-cols-[minmax(0,2fr)_minmax(0,3fr)_auto]" aria-label={`Doubt ${rank}: ${item?.externalId ?? doubt.itemId}`}>
      <div className="min-w-0 space-y-2">
        <p className="flex items-baseline gap-2">
          <span className="num text-xs text-ink-faint">#{rank}</span>
          <span className="truncate font-bold text-ink">{item?.externalId ?? `item ${doubt.itemId}`}</span>
        </p>
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
          Labelled <ClassChip cls={own} />
        </p>
        <p className="text-sm text-ink-soft">
          Its neighbours give that label <span className="num font-bold text-alarm-700">{(100 * doubt.ownShare).toFixed(0)}%</span> and lean to <ClassChip cls={top} />
        </p>
        <ShareBar shares={doubt.shares} classes={classes} own={doubt.classId} />
        {item ? <p className="truncate text-xs text-ink-faint">{fieldLine(item.fields)}</p> : null}
      </div>
      <div className="min-w-0">
        <p className="mb-1 text-xs font-bold uppercase tracking-[0.1em] text-ink-faint">Neighbours, nearest first</p>
        <ol className="gap-6 text-sm sm:columns-2">
          {doubt.neighbours.map((n) => (
            <li key={n.itemId} className="mb-1 flex break-inside-avoid items-center gap-2">
              <span className="h-2.5 w-2.5 shrink-0 rounded-full" style={{ background: byId.get(n.classId)?.colour }} aria-hidden="true" />
              <span className="min-w-0 flex-1 truncate">{items[String(n.itemId)]?.externalId ?? n.itemId}</span>
              <span className="text-xs text-ink-soft">{byId.get(n.classId)?.name}</span>
              <span className="num w-16 text-right text-xs text-ink-faint">{n.distance.toFixed(3)}</span>
            </li>
          ))}
        </ol>
      </div>
      <div className="flex items-start md:justify-end">
        {inDisputes ? (
          <span className="rounded-md border border-amber-100 bg-amber-50 px-3 py-1.5 text-sm font-semibold text-amber-700">In Disputes</span>
        ) : (
          <Button variant="secondary" size="sm" onClick={onSend} disabled={sending}>
            {sending ? "Sending…" : "Send to Disputes"}
          </Button>
        )}
      </div>
    </li>
  );
}
