"use client";

import useSWR from "swr";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import { Input, Select } from "@/components/ui/field";
import { ApiError, apiFetch, fetcher } from "@/lib/client/api";

type Role = "owner" | "reviewer" | "annotator" | "viewer";
type AdminUser = { id: string; name: string | null; email: string; isAdmin: boolean; deactivatedAt: string | null; memberships: Array<{ projectId: number; projectName: string; role: Role }> };

export function UsersPanel({ projects, selfId }: { projects: Array<{ id: number; name: string }>; selfId: string }) {
  const [q, setQ] = useState("");
  const { data, mutate } = useSWR<{ data: AdminUser[] }>(`/api/v1/admin/users${q ? `?q=${encodeURIComponent(q)}` : ""}`, fetcher);
  const [msg, setMsg] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const [projectId, setProjectId] = useState<number | "">(projects[0]?.id ?? "");

  async function patch(userId: string, body: unknown, done: string) {
    setMsg(null);
    try {
      await apiFetch(`/api/v1/admin/users/${userId}`, { method: "PATCH", body });
      await mutate();
      setMsg({ tone: "success", text: done });
    } catch (err) {
      setMsg({ tone: "error", text: err instanceof ApiError ? err.message : "That did not work." });
    }
  }

  const project = projects.find((p) => p.id === projectId);
  return (
    <Card
      title="Users"
      action={
        <div className="flex items-center gap-2">
          <label htmlFor="admin-project" className="text-xs font-semibold text-ink-soft">
            Roles in
          </label>
          <Select id="admin-project" value={projectId} onChange={(e) => setProjectId(Number(e.target.value))} className="w-56">
            {projects.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </Select>
        </div>
      }
    >
      <div className="mb-4 max-w-sm">
        <label htmlFor="user-search" className="sr-only">Search users</label>
        <Input id="user-search" placeholder="Search by e-mail or name" value={q} onChange={(e) => setQ(e.target.value)} />
      </div>
      {msg ? <div className="mb-4"><Notice tone={msg.tone}>{msg.text}</Notice></div> : null}
      <table className="w-full text-left text-sm">
        <thead className="text-xs uppercase tracking-[0.08em] text-ink-faint">
          <tr>
            <th className="py-2">User</th>
            <th className="py-2">Role in {project?.name ?? "project"}</th>
            <th className="py-2">Site admin</th>
            <th className="py-2">Status</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-line">
          {(data?.data ?? []).map((u) => {
            const m = u.memberships.find((x) => x.projectId === projectId);
            return (
              <tr key={u.id}>
                <td className="py-2">
                  <span className="block font-semibold">{u.name ?? "—"}</span>
                  <span className="text-xs text-ink-faint">{u.email}</span>
                </td>
                <td className="py-2">
                  <label htmlFor={`role-${u.id}`} className="sr-only">Role of {u.email}</label>
                  <Select
                    id={`role-${u.id}`}
                    className="max-w-[11rem]"
                    value={m?.role ?? ""}
                    disabled={!projectId}
                    onChange={(e) => void patch(u.id, { membership: { projectId, role: e.target.value || null } }, e.target.value ? `${u.email} is now ${e.target.value} in ${project?.name}.` : `${u.email} removed from ${project?.name}.`)}
                  >
                    <option value="">not a member</option>
                    <option value="owner">owner</option>
                    <option value="reviewer">reviewer</option>
                    <option value="annotator">annotator</option>
                    <option value="viewer">viewer</option>
                  </Select>
                </td>
                <td className="py-2">
                  <input
                    type="checkbox"
                    aria-label={`Site admin: ${u.email}`}
                    checked={u.isAdmin}
                    disabled={u.id === selfId}
                    onChange={(e) => void patch(u.id, { isAdmin: e.target.checked }, e.target.checked ? `${u.email} is now a site admin.` : `${u.email} is no longer a site admin.`)}
                    className="h-4 w-4 accent-pine-600"
                  />
                </td>
                <td className="py-2">
                  {u.id === selfId ? (
                    <span className="text-xs text-ink-faint">you</span>
                  ) : (
                    <Button size="sm" variant={u.deactivatedAt ? "secondary" : "danger"} onClick={() => void patch(u.id, { deactivated: !u.deactivatedAt }, u.deactivatedAt ? `${u.email} reactivated.` : `${u.email} deactivated.`)}>
                      {u.deactivatedAt ? "Reactivate" : "Deactivate"}
                    </Button>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </Card>
  );
}
