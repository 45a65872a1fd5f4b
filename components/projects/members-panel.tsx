"use client";

import useSWR from "swr";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import { Field, Input, Select } from "@/components/ui/field";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";
import { roleDescriptions } from "@/lib/auth/roles";

type Role = "owner" | "reviewer" | "annotator" | "viewer";
type Member = { userId: string; name: string | null; email?: string; role: Role; since: string; deactivated: boolean };
type Invitation = { id: number; email: string; role: Role; expiresAt: string };
const roles: Role[] = ["owner", "reviewer", "annotator", "viewer"];

export function MembersPanel({ projectId, canManage, selfId }: { projectId: number; canManage: boolean; selfId: string }) {
  const url = `/api/v1/projects/${projectId}/members`;
  const { data, mutate, error } = useSWR<{ data: Member[]; invitations: Invitation[] }>(url, fetcher);
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("annotator");
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [msg, setMsg] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function act(fn: () => Promise<unknown>, success: string) {
    setBusy(true);
    setMsg(null);
    try {
      await fn();
      await mutate();
      setMsg({ tone: "success", text: success });
    } catch (err) {
      setMsg({ tone: "error", text: err instanceof ApiError ? err.message : "That did not work. Check your connection." });
      if (err instanceof ApiError) setFieldError(err.fieldError("email"));
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {error ? <Notice tone="error">Members could not be loaded.</Notice> : null}
      {canManage ? (
        <Card title="Invite someone">
          <form
            className="grid items-start gap-4 md:grid-cols-[2fr_1fr_auto]"
            noValidate
            onSubmit={(e) => {
              e.preventDefault();
              setFieldError(undefined);
              void act(async () => {
                await apiFetch(url, { body: { email, role } });
                setEmail("");
              }, `Invitation sent to ${email}.`);
            }}
          >
            <Field label="E-mail" htmlFor="invite-email" error={fieldError}>
              <Input id="invite-email" type="email" value={email} onChange={(e) => setEmail(e.target.value)} invalid={Boolean(fieldError)} />
            </Field>
            <Field label="Role" htmlFor="invite-role" hint={roleDescriptions[role]}>
              <Select id="invite-role" value={role} onChange={(e) => setRole(e.target.value as Role)}>
                {roles.map((r) => (
                  <option key={r} value={r}>
                    {r}
                  </option>
                ))}
              </Select>
            </Field>
            <Button type="submit" className="md:mt-6" disabled={busy}>
              Send invitation
            </Button>
          </form>
        </Card>
      ) : null}
      <Card title={`Members${data ? ` (${data.data.length})` : ""}`}>
        {!data ? (
          <p className="text-sm text-ink-faint">Loading…</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="text-xs uppercase tracking-[0.08em] text-ink-faint">
              <tr>
                <th className="py-2 font-bold">Name</th>
                {canManage ? <th className="py-2 font-bold">E-mail</th> : null}
                <th className="py-2 font-bold">Role</th>
                {canManage ? <th className="py-2 font-bold"><span className="sr-only">Actions</span></th> : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-line">
              {data.data.map((m) => (
                <tr key={m.userId}>
                  <td className="py-2 font-semibold">
                    {m.name ?? "—"} {m.userId === selfId ? <span className="text-xs font-normal text-ink-faint">(you)</span> : null}
                    {m.deactivated ? <span className="ml-2 rounded bg-alarm-50 px-1.5 text-xs text-alarm-700">deactivated</span> : null}
                  </td>
                  {canManage ? <td className="py-2 text-ink-soft">{m.email}</td> : null}
                  <td className="py-2">
                    {canManage ? (
                      <>
                        <label htmlFor={`role-${m.userId}`} className="sr-only">
                          Role of {m.name ?? m.email}
                        </label>
                        <Select id={`role-${m.userId}`} value={m.role} disabled={busy} className="max-w-[10rem]" onChange={(e) => void act(() => apiFetch(`${url}/${m.userId}`, { method: "PATCH", body: { role: e.target.value } }), `Role changed to ${e.target.value}.`)}>
                          {roles.map((r) => (
                            <option key={r} value={r}>
                              {r}
                            </option>
                          ))}
                        </Select>
                      </>
                    ) : (
                      m.role
                    )}
                  </td>
                  {canManage ? (
                    <td className="py-2 text-right">
                      <Button variant="danger" size="sm" disabled={busy} onClick={() => { if (confirm(`Remove ${m.name ?? m.email} from this project?`)) void act(() => apiFetch(`${url}/${m.userId}`, { method: "DELETE" }), "Member removed."); }}>
                        Remove
                      </Button>
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
      {canManage && data?.invitations.length ? (
        <Card title="Open invitations">
          <ul className="divide-y divide-line text-sm">
            {data.invitations.map((inv) => (
              <li key={inv.id} className="flex items-center justify-between py-2">
                <span>
                  <span className="font-semibold">{inv.email}</span> as {inv.role} · expires {new Date(inv.expiresAt).toLocaleDateString("en-GB")}
                </span>
                <Button variant="quiet" size="sm" disabled={busy} onClick={() => void act(() => apiFetch(`/api/v1/projects/${projectId}/invitations/${inv.id}`, { method: "DELETE" }), "Invitation withdrawn.")}>
                  Withdraw
                </Button>
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
    </div>
  );
}
