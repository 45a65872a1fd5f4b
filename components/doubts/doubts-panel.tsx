"use client";

import { useState } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { EmptyState, Notice } from "@/components/ui/card";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";
import type { DoubtsReport } from "@/lib/suggest/doubts";
import type { ReportView } from "@/components/tuning/types";
import { DoubtCard, type ItemBrief } from "./doubt-row";
import type { ClassBrief } from "./share-bar";

type Payload = { data: { report: ReportView<DoubtsReport>; version: number; classes: ClassBrief[]; items: Record<string, ItemBrief>; openDisputes: number[] } };

const PAGE = 25;

export function DoubtsPanel({ projectId }: { projectId: number }) {
  const url = `/api/v1/projects/${projectId}/doubts`;
  const { data, error, mutate } = useSWR<Payload>(url, fetcher, {
    refreshInterval: (d) => (d && (d.data.report.status === "pending" || d.data.report.status === "running") ? 1500 : 0),
  });
  const [shown, setShown] = useState(PAGE);
  const [sending, setSending] = useState<number | null>(null);
  const [sent, setSent] = useState<Set<number>>(new Set());
  const [msg, setMsg] = useState<{ tone: "error" | "success" | "caution"; text: string } | null>(null);

  async function send(itemId: number, name: string) {
    setSending(itemId);
    setMsg(null);
    try {
      await apiFetch(`/api/v1/projects/${projectId}/doubts/${itemId}/dispute`, { method: "POST", body: {} });
      setSent((s) => new Set(s).add(itemId));
      setMsg({ tone: "success", text: `${name} is in Disputes: a reviewer will rule on its label.` });
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) {
        setSent((s) => new Set(s).add(itemId));
        setMsg({ tone: "caution", text: `${name}: ${e.message}` });
      } else setMsg({ tone: "error", text: e instanceof ApiError ? e.message : "Sending failed." });
    } finally {
      setSending(null);
      void mutate();
    }
  }

  if (error) return <Notice tone="error">{error instanceof Error ? error.message : "Could not load Doubts."}</Notice>;
  if (!data) return <p className="text-sm text-ink-soft">Finding doubts…</p>;
  const { report, classes, items, openDisputes } = data.data;
  if (report.status === "pending" || report.status === "running") {
    return (
      <Notice title="Computing Doubts">
        <span className="num">{Math.round(100 * report.progress)}%</span> of the labelled items checked; this page updates by itself.
      </Notice>
    );
  }
  if (report.status === "failed") return <Notice tone="error" title="Doubts could not be computed">{report.message}</Notice>;
  const result = report.result;
  if (!result || "empty" in result) return <EmptyState title="Nothing to check yet">{result && "empty" in result ? result.reason : null}</EmptyState>;
  const open = new Set([...openDisputes, ...sent]);
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        {result.voters.toLocaleString("en")} labelled items checked with k = {result.k}, {result.distance} distance, {result.weighting} votes, each item leaving itself out.{" "}
        <strong className="text-ink">{result.below.toLocaleString("en")}</strong> get less than {Math.round(100 * result.shareBelow)}% of their neighbours&apos; vote for their own label
        {result.below > result.listed ? `; the ${result.listed} lowest are listed` : ""}. A doubt is a reason to look again, not proof of an error.
      </p>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {result.doubts.length === 0 ? (
        <EmptyState title="No doubts">Every labelled item has at least half of its neighbours&apos; vote.</EmptyState>
      ) : (
        <ol className="space-y-3">
          {result.doubts.slice(0, shown).map((d, i) => (
            <DoubtCard
              key={d.itemId}
              rank={i + 1}
              doubt={d}
              item={items[String(d.itemId)]}
              items={items}
              classes={classes}
              inDisputes={open.has(d.itemId)}
              sending={sending === d.itemId}
              onSend={() => send(d.itemId, items[String(d.itemId)]?.externalId ?? `Item ${d.itemId}`)}
            />
          ))}
        </ol>
      )}
      {shown < result.doubts.length ? (
        <div className="flex justify-center">
          <Button variant="secondary" onClick={() => setShown((s) => s + PAGE)}>
            Show {Math.min(PAGE, result.doubts.length - shown)} more
          </Button>
        </div>
      ) : null}
    </div>
  );
}
