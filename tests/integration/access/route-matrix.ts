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
  "GET /api/health/live": { need: "public", call: () => ({ path: "/api/health/live" }) },
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
  "GET /api/v1/projects/[projectId]/agreement": { need: "viewer", call: (w) => ({ path: `${p(w)}/agreement` }) },
  // Items in
  "POST /api/v1/projects/[projectId]/uploads": { need: "owner", call: (w) => ({ path: `${p(w)}/uploads`, body: { fileName: "matrix.csv", size: 20, contentType: "text/csv" } }) },
  "POST /api/v1/projects/[projectId]/uploads/[uploadId]/complete": { need: "owner", call: async (w) => ({ path: `${p(w)}/uploads/${await w.uploadCsv(false)}/complete`, body: {} }) },
  "POST /api/v1/projects/[projectId]/imports/preview": { need: "owner", call: async (w) => ({ path: `${p(w)}/imports/preview`, body: { uploadIds: [await w.uploadCsv()] } }) },
  "GET /api/v1/projects/[projectId]/imports": { need: "owner", call: (w) => ({ path: `${p(w)}/imports` }) },
  "POST /api/v1/projects/[projectId]/imports": {
    need: "owner",
    call: async (w) => ({ path: `${p(w)}/imports`, body: { uploadIds: [await w.uploadCsv()], format: "csv", columns: [{ name: "id", role: "id" }, { name: "a", role: "numeric" }, { name: "b", role: "numeric" }] } }),
  },
  "GET /api/v1/projects/[projectId]/imports/[importId]": { need: "owner", call: async (w) => ({ path: `${p(w)}/imports/${await w.startImport()}` }) },
  "POST /api/v1/projects/[projectId]/imports/[importId]/cancel": { need: "owner", call: async (w) => ({ path: `${p(w)}/imports/${await w.startImport()}/cancel`, body: {} }) },
  "GET /api/v1/projects/[projectId]/imports/[importId]/errors": {
    need: "owner",
    call: async (w) => ({ path: `${p(w)}/imports/${await w.failedImport()}/errors?format=json` }),
  },
  "GET /api/v1/projects/[projectId]/items": { need: "viewer", call: (w) => ({ path: `${p(w)}/items?limit=5` }) },
  "POST /api/v1/projects/[projectId]/items": {
    need: "owner",
    call: (w) => ({ path: `${p(w)}/items`, body: { items: [{ id: `batch-${Math.random().toString(36).slice(2, 9)}`, a: 1, b: 2 }] } }),
  },
  "GET /api/v1/projects/[projectId]/items/[itemId]": { need: "viewer", call: (w) => ({ path: `${p(w)}/items/${w.sampleItem.id}` }) },
  // The neighbour engine
  "GET /api/v1/projects/[projectId]/items/[itemId]/suggestion": { need: "annotator", call: (w) => ({ path: `${p(w)}/items/${w.sampleItem.id}/suggestion` }) },
  "GET /api/v1/projects/[projectId]/tuning": { need: "owner", call: (w) => ({ path: `${p(w)}/tuning` }) },
  "POST /api/v1/projects/[projectId]/tuning": { need: "owner", call: (w) => ({ path: `${p(w)}/tuning`, body: {} }) },
  "GET /api/v1/projects/[projectId]/doubts": { need: "owner", call: (w) => ({ path: `${p(w)}/doubts` }) },
  "POST /api/v1/projects/[projectId]/doubts": { need: "owner", call: (w) => ({ path: `${p(w)}/doubts`, body: {} }) },
  "POST /api/v1/projects/[projectId]/doubts/[itemId]/dispute": { need: "owner", call: async (w) => ({ path: `${p(w)}/doubts/${(await w.freshItem(1)).id}/dispute`, body: {} }) },
  "GET /api/v1/projects/[projectId]/map": { need: "viewer", call: (w) => ({ path: `${p(w)}/map` }) },
  "GET /api/v1/projects/[projectId]/dashboard": { need: "viewer", call: (w) => ({ path: `${p(w)}/dashboard` }) },
  "GET /api/v1/projects/[projectId]/dashboard/agreement": { need: "viewer", call: (w) => ({ path: `${p(w)}/dashboard/agreement` }) },
  // Editions
  "GET /api/v1/projects/[projectId]/editions": { need: "viewer", call: (w) => ({ path: `${p(w)}/editions` }) },
  "POST /api/v1/projects/[projectId]/editions": { need: "owner", call: (w) => ({ path: `${p(w)}/editions`, body: {} }) },
  "GET /api/v1/projects/[projectId]/editions/[editionId]": { need: "viewer", call: (w) => ({ path: `${p(w)}/editions/${w.publishedEdition}` }) },
  "GET /api/v1/projects/[projectId]/editions/[editionId]/download": { need: "viewer", call: (w) => ({ path: `${p(w)}/editions/${w.publishedEdition}/download?format=csv` }) },
  "GET /api/v1/projects/[projectId]/editions/[editionId]/diff": { need: "viewer", call: (w) => ({ path: `${p(w)}/editions/${w.publishedEdition}/diff?against=${w.publishedEdition}` }) },
  "DELETE /api/v1/projects/[projectId]/editions/[editionId]": { need: "admin", call: async (w) => ({ path: `${p(w)}/editions/${await w.newEdition()}` }), note: "site admins only; the admin check comes before the project check" },
  // The labelling loop
  "GET /api/v1/projects/[projectId]/desk/next": { need: "annotator", call: (w) => ({ path: `${p(w)}/desk/next` }) },
  "POST /api/v1/projects/[projectId]/desk/next": { need: "annotator", call: (w) => ({ path: `${p(w)}/desk/next`, body: { exclude: [] } }) },
  "GET /api/v1/projects/[projectId]/desk/stats": { need: "annotator", call: (w) => ({ path: `${p(w)}/desk/stats` }) },
  "POST /api/v1/projects/[projectId]/items/[itemId]/labels": {
    need: "annotator",
    call: async (w) => ({ path: `${p(w)}/items/${(await w.freshItem()).id}/labels`, body: { clientSubmissionId: crypto.randomUUID(), classId: w.classes[0].id, via: "choose" } }),
  },
  "DELETE /api/v1/projects/[projectId]/items/[itemId]/labels": {
    need: "annotator",
    call: async (w, role) => {
      const item = await w.freshItem();
      const auth = await w.auth(role);
      // Label first (as the same caller) so there is something to undo within the window.
      await fetch(`${process.env.VICINAL_TEST_APP_URL}${p(w)}/items/${item.id}/labels`, {
        method: "POST",
        headers: { "content-type": "application/json", ...(auth.token ? { authorization: `Bearer ${auth.token}` } : {}) },
        body: JSON.stringify({ clientSubmissionId: crypto.randomUUID(), classId: w.classes[1].id }),
      });
      return { path: `${p(w)}/items/${item.id}/labels` };
    },
  },
  "POST /api/v1/projects/[projectId]/items/[itemId]/flags": {
    need: "annotator",
    call: async (w) => ({ path: `${p(w)}/items/${(await w.freshItem()).id}/flags`, body: { kind: "flag", comment: "cannot tell from these readings" } }),
  },
  "GET /api/v1/projects/[projectId]/labels": { need: "viewer", call: (w) => ({ path: `${p(w)}/labels` }) },
  "GET /api/v1/projects/[projectId]/disputes": { need: "reviewer", call: (w) => ({ path: `${p(w)}/disputes` }) },
  "GET /api/v1/projects/[projectId]/disputes/[disputeId]": { need: "reviewer", call: async (w) => ({ path: `${p(w)}/disputes/${(await w.freshDispute()).dispute.id}` }) },
  "POST /api/v1/projects/[projectId]/disputes/[disputeId]/ruling": {
    need: "reviewer",
    call: async (w) => ({ path: `${p(w)}/disputes/${(await w.freshDispute()).dispute.id}/ruling`, body: { classId: w.classes[0].id, reason: "matches the control readings" } }),
  },
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
  "GET /api/v1/openapi.json": { need: "public", call: () => ({ path: "/api/v1/openapi.json" }) },
};

/**
 * Server actions, by file and export. Every one is a sign-in-flow action: it acts before or at sign-in, touches no
 * project data and validates its form with zod (`validatedAction`); the browser tests in tests/e2e/foundation.test.ts
 * drive each of them. Any new server action must be added here (the matrix test fails otherwise) together with a
 * role check through `requireRole` if it touches project data.
 */
export const serverActions: Record<string, { need: Need; covered: string }> = {
  "app/(auth)/actions.ts#signInWithPassword": { need: "public", covered: "e2e: signs in with a password, refuses a wrong one" },
  "app/(auth)/actions.ts#signInWithLink": { need: "public", covered: "e2e: signs in with an e-mail link" },
  "app/(auth)/actions.ts#requestReset": { need: "public", covered: "same answer whether or not the account exists" },
  "app/(auth)/actions.ts#completeReset": { need: "public", covered: "needs the secret from the e-mail" },
  "app/(auth)/actions.ts#acceptInvite": { need: "public", covered: "e2e: an invitee accepts from the e-mail; another signed-in account is refused (membership test)" },
  "app/(auth)/actions.ts#signOutAction": { need: "public", covered: "e2e: signs out" },
};
