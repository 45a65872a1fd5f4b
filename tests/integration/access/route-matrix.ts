// The route × role matrix: every route handler under app/api must have an entry here, or the matrix test fails.
import { makeUser } from "../../support/fixtures";
import type { Role, World } from "./world";

export type Need = "public" | "user" | "admin" | "viewer" | "annotator" | "reviewer" | "owner";
export type Call = { path: string; body?: unknown; raw?: string; headers?: Record<string, string> };
export type Entry = { need: Need; call: (w: World, role: Role) => Promise<Call> | Call; sessionOnly?: boolean; note?: string };

const p = (w: World) => `/api/v1/projects/${w.project.id}`;

/** Keyed by "METHOD /route/pattern" as it stands on disk. */
export const matrix: Record<string, Entry> = {
  "GET /api/health": { need: "public", call: () => ({ path: "/api/health" }) },
  "GET /api/v1/me": { need: "user", call: () => ({ path: "/api/v1/me" }) },
  "GET /api/v1/projects": { need: "user", call: () => ({ path: "/api/v1/projects" }) },
  "POST /api/v1/projects": {
    need: "user",
    call: () => ({ path: "/api/v1/projects", body: { name: "Matrix-made project", classes: [{ name: "a", colour: "#2f7f86" }, { name: "b", colour: "#c8922a" }] } }),
  },
  "GET /api/v1/projects/[projectId]": { need: "viewer", call: (w) => ({ path: p(w) }) },
  "PATCH /api/v1/projects/[projectId]": { need: "owner", call: (w) => ({ path: p(w), body: { description: "changed by the matrix" } }) },
  "GET /api/v1/projects/[projectId]/members": { need: "viewer", call: (w) => ({ path: `${p(w)}/members` }) },
  "POST /api/v1/projects/[projectId]/members": {
    need: "owner",
    call: (w) => ({ path: `${p(w)}/members`, body: { email: `invitee-${Math.random().toString(36).slice(2, 8)}@example.test`, role: "viewer" } }),
  },
  "PATCH /api/v1/projects/[projectId]/members/[userId]": {
    need: "owner",
    call: async (w) => {
      const u = await makeUser();
      await w.addMember(u.id, "viewer");
      return { path: `${p(w)}/members/${u.id}`, body: { role: "annotator" } };
    },
  },
  "DELETE /api/v1/projects/[projectId]/members/[userId]": {
    need: "owner",
    call: async (w) => {
      const u = await makeUser();
      await w.addMember(u.id, "viewer");
      return { path: `${p(w)}/members/${u.id}` };
    },
  },
  "DELETE /api/v1/projects/[projectId]/invitations/[invitationId]": {
    need: "owner",
    call: async (w) => ({ path: `${p(w)}/invitations/${await w.makeInvitation()}` }),
  },
  "GET /api/v1/projects/[projectId]/audit": { need: "owner", call: (w) => ({ path: `${p(w)}/audit` }) },
  "GET /api/v1/tokens": { need: "user", call: () => ({ path: "/api/v1/tokens" }) },
  "POST /api/v1/tokens": { need: "user", sessionOnly: true, call: () => ({ path: "/api/v1/tokens", body: { name: "matrix" } }), note: "tokens cannot mint tokens: 403 through a token" },
  "DELETE /api/v1/tokens/[tokenId]": { need: "user", call: async (w, role) => ({ path: `/api/v1/tokens/${await w.freshTokenId(role)}` }), note: "a caller's own fresh token; other users' tokens are 404 (separate test)" },
  "GET /api/v1/admin/users": { need: "admin", call: () => ({ path: "/api/v1/admin/users" }) },
  "PATCH /api/v1/admin/users/[userId]": {
    need: "admin",
    call: async (w) => {
      const u = await makeUser();
      return { path: `/api/v1/admin/users/${u.id}`, body: { membership: { projectId: w.project.id, role: "viewer" } } };
    },
  },
  "GET /api/v1/admin/audit": { need: "admin", call: () => ({ path: "/api/v1/admin/audit" }) },
};
