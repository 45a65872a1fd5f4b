"use client";

import { useEffect, useState } from "react";
import useSWR from "swr";
import { Card, EmptyState } from "@/components/ui/card";
import { fetcher } from "@/lib/client/api";
import { type EditionDetail, type EditionPage, editionsUrl, isBusy, when } from "./api";
import { DiffPanel } from "./diff-panel";
import { DownloadButtons } from "./download-buttons";
import { EditionList } from "./edition-list";
import { ManifestView } from "./manifest-view";
import { PublishForm } from "./publish-form";
import { StatusChip } from "./status-chip";

/** The Editions screen: publish (owners), the list with live status, one edition's manifest and files, and the diff. */
export function EditionsBoard({ projectId, canPublish }: { projectId: number; canPublish: boolean }) {
  const list = useSWR<EditionPage>(`${editionsUrl(projectId)}?limit=100`, fetcher, {
    refreshInterval: (d) => (d?.data.some(isBusy) ? 1000 : 0),
  });
  const editions = list.data?.data ?? [];
  const [picked, setPicked] = useState<number | null>(null);
  const selectedId = picked ?? editions[0]?.id ?? null;
  const selectedSummary = editions.find((e) => e.id === selectedId);
  const detail = useSWR<{ data: EditionDetail }>(selectedId ? `${editionsUrl(projectId)}/${selectedId}` : null, fetcher, {
    refreshInterval: (d) => (d && isBusy(d.data) ? 1000 : 0),
  });
  const shown = detail.data?.data;
  const listStatus = selectedSummary?.status;
  const { mutate } = detail;
  // The list polls; when it sees the selected edition change state, the detail fetches again.
  useEffect(() => {
    if (listStatus) void mutate();
  }, [listStatus, mutate]);

  return (
    <div className="space-y-6">
      {canPublish ? (
        <Card title="Publish an edition">
          <PublishForm
            projectId={projectId}
            nextNumber={(editions[0]?.number ?? 0) + 1}
            onPublished={(e) => {
              setPicked(e.id);
              void list.mutate();
            }}
          />
        </Card>
      ) : null}
      <Card title="Editions">
        {list.isLoading ? (
          <p className="text-sm text-ink-soft">Loading…</p>
        ) : editions.length === 0 ? (
          <EmptyState title="No editions yet">{canPublish ? "Publish the first one above: it freezes today's final labels into files you can hand over." : "The project owner has not published an edition yet."}</EmptyState>
        ) : (
          <EditionList editions={editions} selected={selectedId} onSelect={setPicked} />
        )}
      </Card>
      {shown ? (
        <Card
          title={`Edition ${shown.number}`}
          action={<StatusChip status={shown.status} />}
        >
          {shown.status === "succeeded" && shown.manifest ? (
            <div className="space-y-5">
              <DownloadButtons projectId={projectId} editionId={shown.id} />
              <ManifestView m={shown.manifest} />
            </div>
          ) : shown.status === "failed" ? (
            <p className="text-sm text-alarm-700">This edition could not be built: {shown.message ?? "unknown error"}. Publish again.</p>
          ) : (
            <p className="text-sm text-ink-soft" aria-live="polite">
              Freezing the labels as of {when(shown.createdAt)}… This page updates by itself, and the owner gets an e-mail when it is ready.
            </p>
          )}
        </Card>
      ) : null}
      <Card title="Compare editions">
        <DiffPanel projectId={projectId} editions={editions} />
      </Card>
    </div>
  );
}
