"use client";

import useSWR from "swr";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, EmptyState, Notice } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";

type Token = { id: number; name: string; prefix: string; createdAt: string; lastUsedAt: string | null; revokedAt: string | null };
const when = (d: string | null) => (d ? new Date(d).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : "never");

export function TokensPanel() {
  const { data, mutate } = useSWR<{ data: Token[] }>("/api/v1/tokens", fetcher);
  const [name, setName] = useState("");
  const [secret, setSecret] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();

  async function create(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    setFieldError(undefined);
    try {
      const res = await apiFetch<{ data: { secret: string } }>("/api/v1/tokens", { body: { name } });
      setSecret(res.data.secret);
      setName("");
      await mutate();
    } catch (err) {
      if (err instanceof ApiError) {
        setError(err.message);
        setFieldError(err.fieldError("name"));
      }
    }
  }

  return (
    <div className="space-y-6">
      <Card title="New API token">
        <form onSubmit={create} className="grid items-start gap-4 md:grid-cols-[1fr_auto]" noValidate>
          <Field label="Token name" htmlFor="token-name" error={fieldError} hint="Name it after the script or pipeline that will use it.">
            <Input id="token-name" value={name} onChange={(e) => setName(e.target.value)} invalid={Boolean(fieldError)} />
          </Field>
          <Button type="submit" className="md:mt-6">
            Create token
          </Button>
        </form>
        {error && !fieldError ? <div className="mt-3"><Notice tone="error">{error}</Notice></div> : null}
        {secret ? (
          <div className="mt-4">
            <Notice tone="caution" title="Copy this token now. It is shown only once.">
              <code className="num mt-1 block break-all rounded bg-paper-raised px-2 py-1 text-ink" data-testid="new-token">
                {secret}
              </code>
              <span className="mt-1 block">Send it as <code className="num">Authorization: Bearer …</code>. It acts with your roles in every project.</span>
            </Notice>
          </div>
        ) : null}
      </Card>
      <Card title="Your tokens">
        {!data ? (
          <p className="text-sm text-ink-faint">Loading…</p>
        ) : data.data.length === 0 ? (
          <EmptyState title="No tokens">Tokens let scripts push items, read labels and download editions through the REST API.</EmptyState>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="text-xs uppercase tracking-[0.08em] text-ink-faint">
              <tr>
                <th className="py-2">Name</th>
                <th className="py-2">Starts with</th>
                <th className="py-2">Created</th>
                <th className="py-2">Last used</th>
                <th className="py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody className="divide-y divide-line">
              {data.data.map((t) => (
                <tr key={t.id} className={t.revokedAt ? "text-ink-faint" : ""}>
                  <td className="py-2 font-semibold">{t.name}</td>
                  <td className="num py-2">{t.prefix}…</td>
                  <td className="py-2">{when(t.createdAt)}</td>
                  <td className="py-2">{when(t.lastUsedAt)}</td>
                  <td className="py-2 text-right">
                    {t.revokedAt ? (
                      <span className="text-xs">revoked {when(t.revokedAt)}</span>
                    ) : (
                      <Button variant="danger" size="sm" onClick={() => void apiFetch(`/api/v1/tokens/${t.id}`, { method: "DELETE" }).then(() => mutate())}>
                        Revoke
                      </Button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
    </div>
  );
}
