"use client";

import Link from "next/link";
import type { ReactNode } from "react";
import useSWR from "swr";
import type { DashboardData } from "@/db/queries/dashboard";
import { fetcher } from "@/lib/client/api";
import { AgreementPanel } from "./agreement-panel";
import { BalancePanel } from "./balance-panel";
import { DailyPanel } from "./daily-panel";
import { DisputesPanel } from "./disputes-panel";
import { ProgressPanel } from "./progress-panel";
import { SuggestionPanel } from "./suggestion-panel";

function browserZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
  } catch {
    return "UTC";
  }
}

/** The project dashboard: every figure fetched from the REST routes and refreshed every half minute. */
export function Dashboard({ projectId, canImport, canReview, setup }: { projectId: number; canImport: boolean; canReview: boolean; setup: ReactNode }) {
  const q = new URLSearchParams({ days: "30", tz: browserZone() });
  const { data, error, isLoading } = useSWR<{ data: DashboardData }>(`/api/v1/projects/${projectId}/dashboard?${q}`, fetcher, { refreshInterval: 30_000 });
  const d = data?.data;
  if (error && !d) {
    return (
      <p role="alert" className="rounded-md border border-alarm-500/30 bg-alarm-50 px-4 py-3 text-sm text-alarm-700">
        The dashboard could not be loaded: {error.message}
      </p>
    );
  }
  if (isLoading || !d) {
    return (
      <div className="grid gap-6 xl:grid-cols-[2fr_1fr]" aria-busy="true">
        <div className="h-56 animate-pulse rounded-card bg-paper-sunk" />
        {setup}
      </div>
    );
  }
  if (d.progress.total === 0) {
    return (
      <div className="grid gap-6 xl:grid-cols-[2fr_1fr]">
        <section className="rounded-card border border-dashed border-line-strong bg-paper px-6 py-10 text-center">
          <p className="text-base font-bold text-ink">No items yet</p>
          <p className="mt-2 text-sm text-ink-soft">
            {canImport ? (
              <Link className="font-semibold text-pine-700 underline" href={`/projects/${projectId}/import`}>
                Import items
              </Link>
            ) : (
              "The owner has not imported any."
            )}{" "}
            The dashboard fills in as items are labelled.
          </p>
        </section>
        {setup}
      </div>
    );
  }
  return (
    <div className="space-y-6">
      <div className="grid gap-6 xl:grid-cols-[2fr_1fr]">
        <ProgressPanel progress={d.progress} />
        {setup}
      </div>
      <div className="grid gap-6 xl:grid-cols-[3fr_2fr]">
        <AgreementPanel projectId={projectId} />
        <DisputesPanel disputes={d.disputes} projectId={projectId} canReview={canReview} now={Date.parse(d.generatedAt)} />
      </div>
      <div className="grid gap-6 xl:grid-cols-2">
        <BalancePanel balance={d.balance} />
        <SuggestionPanel use={d.suggestions} classes={d.balance.classes} />
      </div>
      <DailyPanel daily={d.daily} />
      <p className="text-xs text-ink-faint">Figures as of {new Date(d.generatedAt).toLocaleTimeString("en-GB")}; they refresh every 30 seconds.</p>
    </div>
  );
}
