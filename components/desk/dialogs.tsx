"use client";

import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";

function Dialog({ title, onClose, children, labelledBy }: { title: string; onClose: () => void; children: React.ReactNode; labelledBy: string }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const prev = document.activeElement as HTMLElement | null;
    ref.current?.querySelector<HTMLElement>("textarea, button, [tabindex]")?.focus();
    return () => prev?.focus?.();
  }, []);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/30 p-4" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div
        ref={ref}
        role="dialog"
        aria-modal="true"
        aria-labelledby={labelledBy}
        className="w-full max-w-md rounded-card border border-line bg-paper-raised p-5 shadow-card"
        onKeyDown={(e) => {
          if (e.key === "Escape") {
            e.stopPropagation();
            onClose();
          }
        }}
      >
        <h2 id={labelledBy} className="text-base font-extrabold text-ink">
          {title}
        </h2>
        <div className="mt-3">{children}</div>
      </div>
    </div>
  );
}

const keys: Array<[string, string]> = [
  ["Enter", "Take the suggestion"],
  ["1 – 9", "Choose the label with that key"],
  ["S", "Skip this item"],
  ["F", "Flag as unclear, with a comment"],
  ["U", "Undo your last label (shortly after)"],
  ["?", "Show or hide these keys"],
  ["Tab", "Move between buttons; Space or Enter presses"],
];

export function KeyHelp({ onClose }: { onClose: () => void }) {
  return (
    <Dialog title="Desk keys" onClose={onClose} labelledBy="desk-keys-title">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
        {keys.map(([k, what]) => (
          <div key={k} className="contents">
            <dt>
              <kbd className="num rounded border border-line-strong bg-paper px-1.5 py-0.5 text-xs font-bold">{k}</kbd>
            </dt>
            <dd className="text-ink-soft">{what}</dd>
          </div>
        ))}
      </dl>
      <div className="mt-4 flex justify-end">
        <Button variant="secondary" onClick={onClose}>
          Close
        </Button>
      </div>
    </Dialog>
  );
}

export function FlagDialog({ externalId, onSubmit, onClose }: { externalId: string; onSubmit: (comment: string) => Promise<void>; onClose: () => void }) {
  const [comment, setComment] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function submit() {
    if (comment.trim().length < 3) {
      setError("Say in a few words what is unclear.");
      return;
    }
    setBusy(true);
    try {
      await onSubmit(comment.trim());
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  return (
    <Dialog title={`Flag ${externalId} as unclear`} onClose={onClose} labelledBy="flag-title">
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
      >
        <label htmlFor="flag-comment" className="block text-sm font-semibold text-ink">
          What makes it unclear?
        </label>
        <Textarea
          id="flag-comment"
          rows={3}
          value={comment}
          invalid={Boolean(error)}
          onChange={(e) => setComment(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === "Enter" && (e.ctrlKey || e.metaKey)) {
              e.preventDefault();
              void submit();
            }
          }}
          className="mt-1"
        />
        {error ? (
          <p id="flag-comment-error" role="alert" className="mt-1 text-sm font-medium text-alarm-700">
            {error}
          </p>
        ) : (
          <p className="mt-1 text-xs text-ink-faint">The item leaves your queue; reviewers see your comment. Ctrl+Enter sends.</p>
        )}
        <div className="mt-4 flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" disabled={busy}>
            Flag and go on
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
