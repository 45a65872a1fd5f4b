/** Browser-side JSON fetch against Vicinal's REST routes; errors carry the server's message and field errors. */
export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly code: string,
    readonly fields: Array<{ path: string; message: string }> = [],
    readonly details?: unknown,
  ) {
    super(message);
  }
  fieldError(path: string) {
    return this.fields.find((f) => f.path === path)?.message;
  }
}

export async function apiFetch<T = unknown>(url: string, init: { method?: string; body?: unknown; headers?: Record<string, string> } = {}): Promise<T> {
  const res = await fetch(url, {
    method: init.method ?? (init.body !== undefined ? "POST" : "GET"),
    headers: { ...(init.body !== undefined ? { "content-type": "application/json" } : {}), ...init.headers },
    body: init.body !== undefined ? JSON.stringify(init.body) : undefined,
    credentials: "same-origin",
  });
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let data: any = null;
  try {
    data = text ? JSON.parse(text) : null;
  } catch {
    data = null;
  }
  if (!res.ok) {
    const e = data?.error;
    throw new ApiError(e?.message ?? `Request failed (${res.status})`, res.status, e?.code ?? "unknown", e?.fields ?? [], e?.details);
  }
  return data as T;
}

export const fetcher = <T,>(url: string) => apiFetch<T>(url);
