import { z } from "zod";
import { createDocument, type ZodOpenApiOperationObject, type ZodOpenApiPathsObject, type ZodOpenApiResponsesObject } from "zod-openapi";
import { authCodes, errorBodySchema, errorCatalogue, projectCodes, statusOfCode } from "./errors";
import { accountGroup, adminGroup, metaGroup } from "./operations/account";
import { editionsGroup } from "./operations/editions";
import { engineGroup, insightGroup } from "./operations/engine";
import { itemsGroup } from "./operations/items";
import { disputesGroup, labellingGroup } from "./operations/labelling";
import { projectsGroup } from "./operations/projects";
import type { ApiGroup, ApiOperation } from "./types";

export const apiGroups: ApiGroup[] = [projectsGroup, itemsGroup, labellingGroup, engineGroup, disputesGroup, editionsGroup, insightGroup, accountGroup, adminGroup, metaGroup];

const intId = (what: string) => z.coerce.number().int().positive().max(2_147_483_647).meta({ description: `The ${what}'s numeric id.`, example: 12 });
const uuid = (what: string) => z.string().uuid().meta({ description: `The ${what}'s id (UUID).` });
const pathParams: Record<string, z.ZodType> = {
  projectId: intId("project"),
  itemId: intId("item"),
  disputeId: intId("dispute"),
  editionId: intId("edition"),
  invitationId: intId("invitation"),
  tokenId: intId("token"),
  importId: uuid("import"),
  uploadId: uuid("upload"),
  userId: z.string().min(1).max(64).meta({ description: "The user's id." }),
};

const pagingNotes = {
  cursor: "Paged by cursor: pass `nextCursor` (or `next`) from one page as `cursor` to get the next; it is null on the last page. Cursors are signed and tied to the listing and its filters.",
  since: "Incremental: pass the `next` cursor from the previous call as `since`; keep calling while `more` is true.",
  before: "Paged by id: pass `nextBefore` as `before` for older entries.",
} as const;

/** Error codes an operation may answer: those implied by its role, input and paging, then its own. */
export function errorCodesOf(op: ApiOperation): string[] {
  const codes: string[] = [];
  if (op.need === "user") codes.push(...authCodes);
  else if (op.need === "admin") codes.push(...authCodes, "forbidden:admin");
  else if (op.need !== "public") codes.push(...projectCodes);
  if (op.body) codes.push("bad_request:json", "bad_request:validation");
  if (op.query) codes.push("bad_request:validation");
  if (op.paged === "cursor" || op.paged === "since") codes.push("bad_request:cursor");
  codes.push(...(op.errors ?? []));
  const unique = [...new Set(codes)];
  for (const c of unique) if (!errorCatalogue[c]) throw new Error(`${op.method.toUpperCase()} ${op.path}: error code ${c} is not in the catalogue`);
  return unique;
}

function responsesOf(op: ApiOperation): ZodOpenApiResponsesObject {
  const out: ZodOpenApiResponsesObject = {};
  for (const r of op.responses) {
    out[String(r.status) as `${1 | 2 | 3 | 4 | 5}${string}`] = r.schema ? { description: r.description, content: { [r.contentType ?? "application/json"]: { schema: r.schema } } } : { description: r.description };
  }
  const byStatus = new Map<number, string[]>();
  for (const code of errorCodesOf(op)) byStatus.set(statusOfCode(code), [...(byStatus.get(statusOfCode(code)) ?? []), code]);
  for (const [status, codes] of [...byStatus].sort((a, b) => a[0] - b[0])) {
    out[String(status) as `${1 | 2 | 3 | 4 | 5}${string}`] = { description: codes.map((c) => `\`${c}\`: ${errorCatalogue[c]}`).join(" "), content: { "application/json": { schema: errorBodySchema } } };
  }
  return out;
}

function operationOf(op: ApiOperation): ZodOpenApiOperationObject {
  const names = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
  const path = names.length ? z.object(Object.fromEntries(names.map((n) => [n, pathParams[n] ?? z.string()]))) : undefined;
  const roleNote = op.need === "public" ? "Public." : op.need === "user" ? "Any signed-in user." : op.need === "admin" ? "Site admins." : `Role: ${op.need} or above in the project.`;
  const description = [op.description, roleNote, op.paged ? pagingNotes[op.paged] : null].filter(Boolean).join("\n\n");
  const content = op.body ? { "application/json": { schema: op.body }, ...Object.fromEntries((op.bodyAlso ?? []).map((b) => [b.contentType, { schema: b.schema }])) } : undefined;
  return {
    operationId: operationIdOf(op),
    tags: [op.tag],
    summary: op.summary,
    description,
    requestParams: { ...(path ? { path } : {}), ...(op.query ? { query: op.query } : {}) },
    ...(content ? { requestBody: { required: true, content } } : {}),
    responses: responsesOf(op),
    ...(op.need === "public" ? { security: [] } : op.sessionOnly ? { security: [{ sessionCookie: [] }] } : {}),
    "x-vicinal-role": op.need,
    "x-vicinal-error-codes": errorCodesOf(op),
    ...(op.paged ? { "x-vicinal-paging": op.paged } : {}),
  };
}

export function operationIdOf(op: ApiOperation): string {
  const words = op.summary.replace(/\(.*?\)/g, "").split(/[^A-Za-z0-9]+/).filter(Boolean);
  return op.method + words.map((w) => w[0].toUpperCase() + w.slice(1).toLowerCase()).join("");
}

const intro = `Vicinal's REST API for scripts and pipelines.

**Authentication.** Create a personal API token on your account page and send it as \`Authorization: Bearer vcn_…\`. The browser app uses its session cookie instead. Each call checks your role in that project; projects you are not a member of answer 404.

**Errors.** Every error answers JSON \`{ "error": { "code", "message", "fields?" } }\`. The \`code\` is stable (\`kind:subject\`, e.g. \`forbidden:role\`); the message is for people. Validation failures are 422 with one \`fields\` entry per problem. 429 and 503 carry \`Retry-After\`.

**Paging.** Listings page by opaque, signed cursors: pass the previous page's \`nextCursor\` as \`cursor\`. Label sync uses \`since\`/\`next\` instead, and returns only settled labels.`;

const queryNotes: Record<string, string> = {
  cursor: "The `nextCursor` (or `next`) of the previous page; absent for the first page.",
  since: "The `next` cursor of the previous sync; absent to start from the first label.",
  limit: "Page size.",
  before: "The `nextBefore` of the previous page.",
  exclude: "Comma-separated item ids the caller already shows (the current item, when prefetching).",
  tz: "An IANA time zone, e.g. Europe/Berlin; days end at its midnight.",
  days: "How many calendar days the per-day figures cover, today included.",
  format: "Which file or answer form.",
  against: "The id of the earlier edition to compare with.",
  q: "Search text.",
  status: "Filter by status.",
  label: "Filter by final label (class id).",
};

type Param = { in: string; name: string; description?: string };

/** The OpenAPI 3.1 description of every route under /api/v1. */
export function buildOpenApiDocument(serverUrl = "/") {
  const doc = buildBare(serverUrl);
  for (const item of Object.values(doc.paths ?? {})) {
    for (const op of Object.values(item as Record<string, { parameters?: Param[] }>)) {
      for (const p of op.parameters ?? []) if (p.in === "query" && !p.description && queryNotes[p.name]) p.description = queryNotes[p.name];
    }
  }
  return doc;
}

function buildBare(serverUrl: string) {
  const paths: ZodOpenApiPathsObject = {};
  for (const group of apiGroups) {
    for (const op of group.operations) {
      paths[op.path] ??= {};
      if (paths[op.path][op.method]) throw new Error(`duplicate operation ${op.method.toUpperCase()} ${op.path}`);
      paths[op.path][op.method] = operationOf(op);
    }
  }
  return createDocument({
    openapi: "3.1.0",
    info: { title: "Vicinal API", version: "1.0.0", description: intro },
    servers: [{ url: serverUrl }],
    tags: apiGroups.map((g) => ({ name: g.name, description: g.description })),
    security: [{ bearerToken: [] }, { sessionCookie: [] }],
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", bearerFormat: "vcn_…", description: "A personal API token from the account page." },
        sessionCookie: { type: "apiKey", in: "cookie", name: "authjs.session-token", description: "The browser session of the app." },
      },
    },
    paths,
  });
}

export type OpenApiDocument = ReturnType<typeof buildBare>;
