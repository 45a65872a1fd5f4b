import { formatBytes } from "@/lib/imports/format-bytes";

export type UploadState = { key: string; name: string; size: number; progress: number; status: "waiting" | "uploading" | "done" | "failed"; error?: string; uploadId?: string };

/** One progress bar per file, fed by the browser's upload events. */
export function UploadList({ files }: { files: UploadState[] }) {
  if (files.length === 0) return null;
  const shown = files.slice(0, 200);
  return (
    <ul className="max-h-80 space-y-2 overflow-y-auto" aria-label="Uploads">
      {shown.map((f) => (
        <li key={f.key} className="rounded-md border border-line bg-paper-raised px-3 py-2">
          <div className="flex items-baseline justify-between gap-3 text-sm">
            <span className="truncate font-medium text-ink">{f.name}</span>
            <span className="shrink-0 text-xs text-ink-faint">
              {formatBytes(f.size)} · {f.status === "failed" ? "failed" : f.status === "done" ? "uploaded" : `${Math.floor(f.progress * 100)}%`}
            </span>
          </div>
          <div className="mt-1.5 h-1.5 overflow-hidden rounded-full bg-paper-sunk" role="progressbar" aria-label={`Upload of ${f.name}`} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.floor(f.progress * 100)}>
            <div className={`h-full rounded-full transition-[width] ${f.status === "failed" ? "bg-alarm-500" : f.status === "done" ? "bg-pine-500" : "bg-amber-500"}`} style={{ width: `${Math.max(2, f.progress * 100)}%` }} />
          </div>
          {f.error ? <p className="mt-1 text-xs font-medium text-alarm-700">{f.error}</p> : null}
        </li>
      ))}
      {files.length > shown.length ? <li className="text-xs text-ink-faint">…and {files.length - shown.length} more files</li> : null}
    </ul>
  );
}
