"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError, apiFetch } from "@/lib/client/api";
import { type DownloadLink, editionsUrl } from "./api";

const formats = [
  { format: "csv", label: "CSV" },
  { format: "parquet", label: "Parquet" },
  { format: "jsonl", label: "JSON Lines" },
  { format: "manifest", label: "Manifest" },
] as const;

/** Each button asks for a short-lived link to one file and follows it. */
export function DownloadButtons({ projectId, editionId }: { projectId: number; editionId: number }) {
  const [error, setError] = useState<string | null>(null);
  async function go(format: string) {
    setError(null);
    try {
      const link = await apiFetch<DownloadLink>(`${editionsUrl(projectId)}/${editionId}/download?format=${format}`);
      window.location.assign(link.url);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The link could not be made.");
    }
  }
  return (
    <div>
      <div className="flex flex-wrap gap-2">
        {formats.map((f) => (
          <Button key={f.format} variant={f.format === "csv" ? "primary" : "secondary"} size="sm" onClick={() => void go(f.format)}>
            Download {f.label}
          </Button>
        ))}
      </div>
      <p className="mt-1 text-xs text-ink-faint">Links are signed for a few minutes and open one file each.</p>
      {error ? <p role="alert" className="mt-1 text-sm text-alarm-700">{error}</p> : null}
    </div>
  );
}
