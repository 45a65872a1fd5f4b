"use client";

import { useRef, useState } from "react";
import { mutate } from "swr";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import type { RoleMapping } from "@/lib/imports/types";
import { call, type ImportView, type Preview } from "./api";
import { DropZone } from "./drop-zone";
import { ImportStatus } from "./import-status";
import { mappingFromPreview, RoleMapper } from "./role-mapper";
import { uploadFile } from "./upload-file";
import { UploadList, type UploadState } from "./upload-list";

type Step = "pick" | "uploading" | "confirm" | "importing";

/** Upload → preview and confirm roles → import with progress. */
export function ImportWizard({ projectId }: { projectId: number }) {
  const [step, setStep] = useState<Step>("pick");
  const [files, setFiles] = useState<UploadState[]>([]);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [mapping, setMapping] = useState<RoleMapping>([]);
  const [error, setError] = useState<string | null>(null);
  const [importId, setImportId] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const abort = useRef<AbortController | null>(null);

  const patch = (key: string, p: Partial<UploadState>) => setFiles((fs) => fs.map((f) => (f.key === key ? { ...f, ...p } : f)));

  async function start(list: File[]) {
    if (list.length === 0) return;
    setError(null);
    const states = list.map((f, i) => ({ key: `${i}-${f.name}`, name: f.webkitRelativePath || f.name, size: f.size, progress: 0, status: "waiting" as const }));
    setFiles(states);
    setStep("uploading");
    abort.current = new AbortController();
    const ids: string[] = [];
    const queue = list.map((file, i) => ({ file, key: states[i].key }));
    let failed = false;
    const worker = async () => {
      for (let job = queue.shift(); job && !failed; job = queue.shift()) {
        const { file, key } = job;
        patch(key, { status: "uploading" });
        try {
          const id = await uploadFile(projectId, file, (progress) => patch(key, { progress }), abort.current!.signal);
          ids[list.indexOf(file)] = id;
          patch(key, { status: "done", progress: 1, uploadId: id });
        } catch (e) {
          failed = true;
          patch(key, { status: "failed", error: (e as Error).message });
          setError(`${file.name}: ${(e as Error).message}`);
        }
      }
    };
    await Promise.all(Array.from({ length: Math.min(3, list.length) }, worker));
    if (failed) return;
    try {
      const { preview: p } = await call<{ preview: Preview }>(`/api/v1/projects/${projectId}/imports/preview`, { json: { uploadIds: ids } });
      setPreview(p);
      setMapping(p.table ? mappingFromPreview(p.table) : []);
      setStep("confirm");
    } catch (e) {
      setError((e as Error).message);
    }
  }

  async function runImport() {
    if (!preview) return;
    setBusy(true);
    setError(null);
    try {
      const uploadIds = files.map((f) => f.uploadId!).filter(Boolean);
      const body =
        preview.format === "images"
          ? { uploadIds, format: "images", embeddingsUploadId: preview.table?.uploadId, embeddingsColumns: preview.table ? mapping : undefined }
          : { uploadIds, format: preview.format, columns: mapping, delimiter: preview.table?.delimiter };
      const { import: imp } = await call<{ import: ImportView }>(`/api/v1/projects/${projectId}/imports`, { json: body });
      setImportId(imp.id);
      setStep("importing");
      void mutate(`/api/v1/projects/${projectId}/imports`);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  function reset() {
    abort.current?.abort();
    setFiles([]);
    setPreview(null);
    setImportId(null);
    setError(null);
    setStep("pick");
  }

  return (
    <div className="space-y-6">
      {step === "pick" ? <DropZone onFiles={start} /> : null}
      {files.length > 0 ? (
        <Card title="Files" action={step !== "importing" ? <Button variant="quiet" size="sm" onClick={reset}>Start over</Button> : null}>
          <UploadList files={files} />
        </Card>
      ) : null}
      {error ? <Notice tone="error" title="That did not work">{error}</Notice> : null}
      {step === "confirm" && preview ? (
        <Card title={preview.table || !preview.images ? "Confirm the columns" : "Confirm the images"}>
          {preview.featureSchema ? (
            <div className="mb-4">
              <Notice tone="info" title="This project already has a feature schema">
                Later imports must bring the same feature columns: {preview.featureSchema.columns.map((c) => `${c.name} (${c.kind}${c.kind === "vector" ? ` ×${c.width}` : ""})`).join(", ")}.
              </Notice>
            </div>
          ) : null}
          {preview.images ? (
            <p className="mb-4 text-sm text-ink-soft" data-testid="image-summary">
              {preview.images.files} image file{preview.images.files === 1 ? "" : "s"}
              {preview.images.zips ? ` and ${preview.images.zips} zip${preview.images.zips === 1 ? "" : "s"}` : ""}.{" "}
              {preview.table
                ? "Their vectors come from the embeddings file below: mark the column with the file names as the id."
                : "Each gets a thumbnail and a default vector from its pixels (an 8 × 8 colour thumbnail, 192 numbers)."}
            </p>
          ) : null}
          {preview.table ? <RoleMapper table={preview.table} mapping={mapping} onChange={setMapping} roles={preview.images ? ["id", "vector", "numeric", "ignore"] : undefined} /> : null}
          <div className="mt-5 flex gap-3">
            <Button onClick={runImport} disabled={busy}>
              {busy ? "Starting…" : "Import"}
            </Button>
          </div>
        </Card>
      ) : null}
      {step === "importing" && importId ? (
        <Card title="Import" action={<Button variant="quiet" size="sm" onClick={reset}>Import more</Button>}>
          <ImportStatus projectId={projectId} importId={importId} onFinished={() => void mutate(`/api/v1/projects/${projectId}/imports`)} />
        </Card>
      ) : null}
    </div>
  );
}
