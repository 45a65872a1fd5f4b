"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { Card, EmptyState, Notice } from "@/components/ui/card";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";
import type { TuningReport } from "@/lib/suggest/tuning";
import { DistanceKey, MetricChart } from "./tuning-charts";
import { ReliabilityTable, TuningTable } from "./tuning-table";
import { distanceLook, type TuningPayload } from "./types";

export function TuningPanel({ projectId }: { projectId: number }) {
  const url = `/api/v1/projects/${projectId}/tuning`;
  const router = useRouter();
  const { data, error, mutate } = useSWR<TuningPayload>(url, fetcher, {
    refreshInterval: (d) => (d?.data.report && (d.data.report.status === "pending" || d.data.report.status === "running") ? 1500 : 0),
  });
  const [picked, setPicked] = useState<{ k: number; distance: string } | null>(null);
  const [busy, setBusy] = useState<"run" | "apply" | null>(null);
  const [msg, setMsg] = useState<{ tone: "error" | "success"; text: string } | null>(null);

  async function run() {
    setBusy("run");
    setMsg(null);
    try {
      await apiFetch(url, { method: "POST", body: {} });
      await mutate();
    } catch (e) {
      setMsg({ tone: "error", text: e instanceof ApiError ? e.message : "Starting Tuning failed." });
    } finally {
      setBusy(null);
    }
  }

  async function apply(k: number, distance: string) {
    setBusy("apply");
    setMsg(null);
    try {
      await apiFetch(`/api/v1/projects/${projectId}`, { method: "PATCH", body: { settings: { k, distance } } });
      setMsg({ tone: "success", text: `Suggestions now use k = ${k} and ${distanceLook[distance].label} distance. The change is in the audit trail.` });
      await mutate();
      router.refresh();
    } catch (e) {
      setMsg({ tone: "error", text: e instanceof ApiError ? e.message : "Applying failed." });
    } finally {
      setBusy(null);
    }
  }

  if (error) return <Notice tone="error">{error instanceof Error ? error.message : "Could not load Tuning."}</Notice>;
  if (!data) return <p className="text-sm text-ink-soft">Loading…</p>;
  const { report, version, voters, settings } = data.data;
  const inFlight = report && (report.status === "pending" || report.status === "running");
  const result = report?.status === "succeeded" && report.result && !("empty" in report.result) ? (report.result as TuningReport) : null;
  const selected = picked ?? { k: settings.k, distance: settings.distance };
  const chosen = result?.results.find((r) => r.k === selected.k && r.distance === selected.distance) ?? null;
  const isCurrent = selected.k === settings.k && selected.distance === settings.distance;

  const runButton = (
    <Button onClick={run} disabled={busy !== null || !!inFlight || voters < 2}>
      {inFlight ? "Running…" : result ? "Run again" : "Run Tuning"}
    </Button>
  );

  return (
    <div className="space-y-6">
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {report?.status === "failed" ? <Notice tone="error" title="The last run failed">{report.message}</Notice> : null}
      {inFlight ? (
        <Card title="Running leave-one-out">
          <div role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(100 * report.progress)} aria-label="Tuning progress" className="h-2 overflow-hidden rounded bg-paper-sunk">
            <div className="h-full bg-pine-500 transition-all" style={{ width: `${Math.round(100 * report.progress)}%` }} />
          </div>
          <p className="num mt-2 text-sm text-ink-soft">{Math.round(100 * report.progress)}% — this page updates by itself.</p>
        </Card>
      ) : null}
      {!result && !inFlight ? (
        <EmptyState title={voters < 2 ? "Not enough labelled items yet" : "No Tuning run yet"} action={runButton}>
          Leave-one-out scores every labelled item ({voters.toLocaleString("en")} vote now) by the vote of its neighbours for k = 1, 3, …, 51 and each distance.
        </EmptyState>
      ) : null}
      {result ? (
        <>
          <Card title="Scores against k" action={runButton}>
            <p className="mb-3 text-sm text-ink-soft">
              {result.sampling.charAt(0).toUpperCase() + result.sampling.slice(1)}; {result.weighting} votes. {report!.knnVersion !== version ? <strong className="text-amber-700">Labels have changed since this run (version {report!.knnVersion} → {version}).</strong> : "Up to date with the current labels."}
            </p>
            <DistanceKey distances={result.distances} />
            <div className="mt-3 grid gap-4 lg:grid-cols-3">
              <MetricChart results={result.results} metric="accuracy" title="Accuracy (higher is better)" chosenK={selected.k} percent />
              <MetricChart results={result.results} metric="macroF1" title="Macro-F1 (higher is better)" chosenK={selected.k} percent={false} />
              <MetricChart results={result.results} metric="logLoss" title="Log-loss (lower is better)" chosenK={selected.k} percent={false} />
            </div>
            <p className="mt-3 text-xs text-ink-faint">Log-loss smoothing: {result.smoothing}. Small k draws rough, local boundaries; large k smooth, global ones.</p>
          </Card>
          <div className="grid gap-6 2xl:grid-cols-[minmax(0,4fr)_minmax(0,3fr)]">
            <Card title="All results">
              <TuningTable results={result.results} selected={selected} onSelect={(k, distance) => setPicked({ k, distance })} />
            </Card>
            <Card
              title="Reliability"
              action={
                <Button onClick={() => apply(selected.k, selected.distance)} disabled={busy !== null || isCurrent}>
                  {isCurrent ? "In use" : `Apply k = ${selected.k}, ${distanceLook[selected.distance].label}`}
                </Button>
              }
            >
              {chosen ? <ReliabilityTable result={chosen} /> : <p className="text-sm text-ink-soft">The project&apos;s k = {selected.k} is outside the range tried; pick a row.</p>}
            </Card>
          </div>
        </>
      ) : null}
    </div>
  );
}
