import { call } from "./api";

type Single = { upload: { id: string }; mode: "single"; url: string };
type Multi = { upload: { id: string }; mode: "multipart"; multipartId: string; partSize: number; parts: Array<{ partNumber: number; url: string }> };

/** PUTs bytes with XMLHttpRequest, whose upload events give real progress. Resolves with the ETag. */
function put(url: string, body: Blob, contentType: string | null, onProgress: (sent: number) => void, signal: AbortSignal): Promise<string> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    if (contentType) xhr.setRequestHeader("content-type", contentType);
    xhr.upload.onprogress = (e) => onProgress(e.loaded);
    xhr.onload = () => (xhr.status >= 200 && xhr.status < 300 ? resolve(xhr.getResponseHeader("ETag") ?? "") : reject(new Error(`The bucket answered ${xhr.status}.`)));
    xhr.onerror = () => reject(new Error("The upload was interrupted (network error)."));
    xhr.onabort = () => reject(new Error("Upload stopped."));
    signal.addEventListener("abort", () => xhr.abort());
    xhr.send(body);
  });
}

/** Registers a file, sends it straight to the bucket (in parts when large), and confirms it. Returns the upload id. */
export async function uploadFile(projectId: number, file: File, onProgress: (fraction: number) => void, signal: AbortSignal): Promise<string> {
  const contentType = file.type || "application/octet-stream";
  const base = `/api/v1/projects/${projectId}/uploads`;
  const start = await call<Single | Multi>(base, { json: { fileName: file.webkitRelativePath || file.name, size: file.size, contentType } });
  if (start.mode === "single") {
    await put(start.url, file, contentType, (sent) => onProgress(sent / Math.max(file.size, 1)), signal);
    await call(`${base}/${start.upload.id}/complete`, { json: {} });
  } else {
    const sent = new Map<number, number>();
    const report = () => onProgress([...sent.values()].reduce((a, b) => a + b, 0) / file.size);
    const parts: Array<{ partNumber: number; etag: string }> = [];
    // Two parts in flight: enough to fill the pipe without starving the page.
    const queue = [...start.parts];
    const worker = async () => {
      for (let p = queue.shift(); p; p = queue.shift()) {
        const blob = file.slice((p.partNumber - 1) * start.partSize, p.partNumber * start.partSize);
        const n = p.partNumber;
        const etag = await put(p.url, blob, null, (s) => {
          sent.set(n, s);
          report();
        }, signal);
        parts.push({ partNumber: n, etag });
      }
    };
    await Promise.all([worker(), worker()]);
    await call(`${base}/${start.upload.id}/complete`, { json: { multipartId: start.multipartId, parts } });
  }
  onProgress(1);
  return start.upload.id;
}
