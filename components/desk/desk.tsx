"use client";

import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, EmptyState, Notice } from "@/components/ui/card";
import { FlagDialog, KeyHelp } from "./dialogs";
import { ItemFields } from "./item-fields";
import { SuggestionPanel } from "./suggestion-panel";
import type { DeskClass, DeskColumn } from "./types";
import { useDesk } from "./use-desk";

const typing = (t: EventTarget | null) => t instanceof HTMLElement && (t.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(t.tagName));

function Counter({ label, value }: { label: string; value: number | undefined }) {
  return (
    <div className="rounded-md border border-line bg-paper-raised px-3 py-1.5 text-right">
      <p className="text-[11px] font-bold uppercase tracking-[0.1em] text-ink-faint">{label}</p>
      <p className="num text-lg font-semibold text-ink" aria-live="polite">
        {value == null ? "…" : value.toLocaleString("en")}
      </p>
    </div>
  );
}

export function Desk({ projectId, projectName, classes, columns }: { projectId: number; projectName: string; classes: DeskClass[]; columns: DeskColumn[] }) {
  const desk = useDesk(projectId);
  const { item, stats, last } = desk;
  const [dialog, setDialog] = useState<"keys" | "flag" | null>(null);
  const [now, setNow] = useState(() => Date.now());
  const undoLeft = last ? Math.max(0, Math.ceil((last.undoUntil - now) / 1000)) : 0;

  useEffect(() => {
    if (!last) return;
    setNow(Date.now());
    const t = setInterval(() => setNow(Date.now()), 250);
    return () => clearInterval(t);
  }, [last]);

  const top = item?.suggestion?.topClassId != null ? classes.find((c) => c.id === item.suggestion?.topClassId) : undefined;
  const take = () => top && void desk.label(top, "take");

  useEffect(() => {
    function onKey(e: KeyboardEvent) {
      if (dialog || e.ctrlKey || e.metaKey || e.altKey || typing(e.target)) return;
      const onControl = e.target instanceof HTMLElement && ["BUTTON", "A"].includes(e.target.tagName);
      if (e.key === "?") {
        e.preventDefault();
        setDialog("keys");
      } else if (e.key === "u" || e.key === "U") {
        e.preventDefault();
        void desk.undo();
      } else if (!item) {
        return;
      } else if (e.key === "Enter" && !onControl) {
        e.preventDefault();
        take();
      } else if (/^[1-9]$/.test(e.key)) {
        const cls = classes.find((c) => c.keyHint === Number(e.key));
        if (cls) {
          e.preventDefault();
          void desk.label(cls, "choose");
        }
      } else if (e.key === "s" || e.key === "S") {
        e.preventDefault();
        void desk.flag("skip");
      } else if (e.key === "f" || e.key === "F") {
        e.preventDefault();
        setDialog("flag");
      }
    }
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  });

  return (
    <main className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-xs font-bold uppercase tracking-[0.14em] text-ink-faint">Desk · {projectName}</p>
          <h1 className="num mt-1 text-2xl font-extrabold tracking-tight text-ink" aria-live="polite">
            {item ? item.externalId : desk.loading ? "Finding your next item…" : "Nothing to label"}
          </h1>
        </div>
        <div className="flex items-stretch gap-2">
          <Counter label="Done today" value={stats?.doneToday} />
          <Counter label="Remaining" value={stats?.remainingItems} />
          <button type="button" onClick={() => setDialog("keys")} className="rounded-md border border-line bg-paper-raised px-3 text-sm font-semibold text-ink-soft hover:text-ink" aria-keyshortcuts="?">
            Keys <kbd className="num ml-1 rounded border border-line px-1 text-xs">?</kbd>
          </button>
        </div>
      </div>

      <p className="flex items-start gap-2 text-xs leading-relaxed text-ink-soft">
        <span aria-hidden="true" className="mt-1 h-2 w-2 shrink-0 rounded-full bg-amber-500" />
        Suggestions can anchor your judgement: read the item first, then look at the vote. Some items come without one.
      </p>

      {desk.message ? <Notice tone={desk.message.tone === "error" ? "error" : "info"}>{desk.message.text}</Notice> : null}
      {desk.loadError ? <Notice tone="error">The Desk could not load your next item: {desk.loadError.message}</Notice> : null}

      {!item && !desk.loading ? (
        <EmptyState title="You are done for now">
          No item needs your label at the moment: every open item has its labels or is reserved by someone else. Leases of idle annotators expire, so look again later.
        </EmptyState>
      ) : null}

      {item ? (
        <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
          <Card title="The item">
            <ItemFields fields={item.fields} columns={columns} imageUrl={item.imageUrl} externalId={item.externalId} />
          </Card>
          <SuggestionPanel item={item} classes={classes} columns={columns} onChoose={(c) => void desk.label(c, "choose")} onTake={take} />
        </div>
      ) : null}

      <div className="sticky bottom-0 flex flex-wrap items-center gap-2 border-t border-line bg-paper/95 py-3 backdrop-blur">
        <Button onClick={take} disabled={!top} aria-keyshortcuts="Enter">
          Take {top ? `“${top.name}”` : "suggestion"} <kbd className="num rounded bg-white/20 px-1 text-xs">Enter</kbd>
        </Button>
        <Button variant="secondary" onClick={() => void desk.flag("skip")} disabled={!item} aria-keyshortcuts="S">
          Skip <kbd className="num text-xs text-ink-faint">S</kbd>
        </Button>
        <Button variant="secondary" onClick={() => setDialog("flag")} disabled={!item} aria-keyshortcuts="F">
          Unclear… <kbd className="num text-xs text-ink-faint">F</kbd>
        </Button>
        <Button variant="quiet" onClick={() => void desk.undo()} disabled={!last || undoLeft === 0} aria-keyshortcuts="U">
          Undo {last && undoLeft > 0 ? `${last.item.externalId} (${undoLeft} s)` : ""} <kbd className="num text-xs">U</kbd>
        </Button>
        {stats ? <span className="ml-auto text-xs text-ink-faint">{stats.remainingForYou.toLocaleString("en")} open items you have not labelled · {stats.overlap} labels per item</span> : null}
      </div>

      {dialog === "keys" ? <KeyHelp onClose={() => setDialog(null)} /> : null}
      {dialog === "flag" && item ? (
        <FlagDialog
          externalId={item.externalId}
          onClose={() => setDialog(null)}
          onSubmit={async (comment) => {
            await desk.flag("flag", comment);
            setDialog(null);
          }}
        />
      ) : null}
    </main>
  );
}
