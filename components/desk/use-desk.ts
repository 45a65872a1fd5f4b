"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import useSWR from "swr";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";
import type { DeskClass, DeskItem, DeskStats } from "./types";

type Next = { data: DeskItem | null };
type Done = { item: DeskItem; labelId: number; undoUntil: number };
const swrOpts = { revalidateOnFocus: false, revalidateOnReconnect: false, revalidateIfStale: false, shouldRetryOnError: false } as const;

/** Posts once per submission id, retrying network failures and 5xx with the same id (the server stores it once). */
async function postWithRetry<T>(url: string, body: unknown, attempts = 4): Promise<T> {
  for (let i = 0; ; i += 1) {
    try {
      return await apiFetch<T>(url, { body });
    } catch (e) {
      const retriable = !(e instanceof ApiError) || e.status >= 500;
      if (!retriable || i >= attempts - 1) throw e;
      await new Promise((r) => setTimeout(r, 300 * 2 ** i));
    }
  }
}

/**
 * The Desk's state: the current item and a prefetched next one (both leased to the annotator), the counters,
 * and the actions. The next item is fetched while the current one is worked on, so it shows at once.
 */
export function useDesk(projectId: number) {
  const base = `/api/v1/projects/${projectId}`;
  const [tz] = useState(() => Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC");
  const [pending, setPending] = useState<number[]>([]);
  const [last, setLast] = useState<Done | null>(null);
  const [message, setMessage] = useState<{ tone: "error" | "info"; text: string } | null>(null);
  const current = useSWR<Next>(`${base}/desk/next`, fetcher, swrOpts);
  const item = current.data?.data ?? null;
  const exclude = item ? [item.itemId, ...pending.filter((p) => p !== item.itemId)].slice(0, 4) : [];
  const upcoming = useSWR<Next>(item ? `${base}/desk/next?exclude=${exclude.join(",")}` : null, fetcher, swrOpts);
  const stats = useSWR<{ data: DeskStats }>(`${base}/desk/stats?tz=${encodeURIComponent(tz)}`, fetcher, { revalidateOnFocus: true });
  const busy = useRef(false);

  const nextUp = upcoming.data?.data ?? null;
  useEffect(() => {
    if (nextUp?.imageUrl) new Image().src = nextUp.imageUrl;
  }, [nextUp?.imageUrl]);

  /** Shows the prefetched item at once; false when none is ready (then ask the server once the write is done). */
  const swapToNext = useCallback(async () => {
    if (!nextUp || nextUp.itemId === item?.itemId) return false;
    await current.mutate({ data: nextUp }, { revalidate: false });
    return true;
  }, [current, item?.itemId, nextUp]);

  const label = useCallback(
    async (cls: DeskClass, via: "take" | "choose") => {
      if (!item || busy.current) return;
      busy.current = true;
      const shown = item;
      const clientSubmissionId = crypto.randomUUID();
      const sentAt = Date.now();
      setPending((p) => [...p, shown.itemId]);
      setMessage(null);
      const swapped = await swapToNext();
      busy.current = false;
      try {
        const res = await postWithRetry<{ data: { label: { id: number; createdAt: string; undoUntil: string } } }>(`${base}/items/${shown.itemId}/labels`, {
          clientSubmissionId,
          classId: cls.id,
          via,
          suggestionToken: shown.suggestionToken,
        });
        // The window is the server's, measured from when this browser sent the label (robust to clock skew).
        const windowMs = new Date(res.data.label.undoUntil).getTime() - new Date(res.data.label.createdAt).getTime();
        setLast({ item: shown, labelId: res.data.label.id, undoUntil: sentAt + windowMs });
      } catch (e) {
        setMessage({ tone: "error", text: `Your label for ${shown.externalId} was not stored: ${(e as Error).message}` });
      } finally {
        setPending((p) => p.filter((id) => id !== shown.itemId));
        if (!swapped) await current.mutate();
        void stats.mutate();
      }
    },
    [base, current, item, stats, swapToNext],
  );

  const flag = useCallback(
    async (kind: "skip" | "flag", comment?: string) => {
      if (!item) return;
      const shown = item;
      setPending((p) => [...p, shown.itemId]);
      try {
        await apiFetch(`${base}/items/${shown.itemId}/flags`, { body: { kind, comment } });
        setMessage({ tone: "info", text: kind === "skip" ? `Skipped ${shown.externalId}.` : `Flagged ${shown.externalId} as unclear.` });
        if (!(await swapToNext())) await current.mutate();
      } finally {
        setPending((p) => p.filter((id) => id !== shown.itemId));
        void stats.mutate();
      }
    },
    [base, current, item, stats, swapToNext],
  );

  const undo = useCallback(async () => {
    if (!last) return;
    if (Date.now() > last.undoUntil) {
      setMessage({ tone: "info", text: "Too late to undo: labels can be undone only for a few seconds." });
      setLast(null);
      return;
    }
    try {
      await apiFetch(`${base}/items/${last.item.itemId}/labels`, { method: "DELETE" });
      await current.mutate({ data: last.item }, { revalidate: false });
      setMessage({ tone: "info", text: `Label on ${last.item.externalId} undone; label it again.` });
    } catch (e) {
      setMessage({ tone: "error", text: (e as Error).message });
    } finally {
      setLast(null);
      void stats.mutate();
    }
  }, [base, current, last, stats]);

  return { item, loading: current.isLoading, loadError: current.error as Error | undefined, stats: stats.data?.data ?? null, last, message, setMessage, label, flag, undo };
}
