"use client";

import { useRef, useState } from "react";
import { buttonClass } from "@/components/ui/button";

/** Drag files (or a folder of images) here, or pick them. */
export function DropZone({ onFiles, disabled }: { onFiles: (files: File[]) => void; disabled?: boolean }) {
  const [over, setOver] = useState(false);
  const filesRef = useRef<HTMLInputElement>(null);
  const folderRef = useRef<HTMLInputElement>(null);
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        if (!disabled) onFiles([...e.dataTransfer.files]);
      }}
      className={`rounded-card border-2 border-dashed px-6 py-10 text-center transition-colors ${over ? "border-pine-500 bg-pine-50" : "border-line-strong bg-paper"}`}
    >
      <p className="text-base font-bold text-ink">Drop files here</p>
      <p className="mx-auto mt-1 max-w-lg text-sm text-ink-soft">
        A table (CSV, TSV, JSON Lines or Parquet), or images (PNG, JPEG, WebP — several files, a folder or a zip), optionally with one CSV or JSON Lines file of embeddings keyed by file name.
      </p>
      <div className="mt-4 flex justify-center gap-3">
        <label className={buttonClass("primary")}>
          Choose files
          <input ref={filesRef} type="file" multiple className="sr-only" disabled={disabled} aria-label="Choose files" onChange={(e) => e.target.files && onFiles([...e.target.files])} />
        </label>
        <label className={buttonClass("secondary")}>
          Choose a folder
          <input
            ref={(el) => {
              folderRef.current = el;
              el?.setAttribute("webkitdirectory", "");
            }}
            type="file"
            multiple
            className="sr-only"
            disabled={disabled}
            aria-label="Choose a folder"
            onChange={(e) => e.target.files && onFiles([...e.target.files].filter((f) => !f.name.startsWith(".")))}
          />
        </label>
      </div>
    </div>
  );
}
