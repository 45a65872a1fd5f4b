import { listItemsByProjectId, type ItemCursor } from "@/db/queries/items";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { importBatch, parseBatchBody } from "@/lib/imports/batch";
import { limits } from "@/lib/imports/limits";
import { listItemsQuerySchema } from "./schema";

/** Server-side paging by cursor, with sorting and filters (status, label, vote share range, id search). */
export const GET = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "viewer");
  const q = listItemsQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const scope = `items:${projectId}:${q.sort}:${q.dir}`;
  const cursor = decodeCursor<ItemCursor>(scope, q.cursor ?? null);
  const page = await listItemsByProjectId({
    projectId,
    filter: { status: q.status, classId: q.label, shareMin: q.shareMin, shareMax: q.shareMax, q: q.q },
    sort: q.sort,
    dir: q.dir,
    cursor,
    limit: q.limit,
  });
  return json({
    items: page.items.map(({ sortValue: _s, seq, ...rest }) => ({ ...rest, seq: Number(seq) })),
    nextCursor: page.next ? encodeCursor(scope, page.next) : null,
    total: page.total,
  });
});

/** A batch of up to 10 000 items (JSON or NDJSON) from a pipeline; idempotent by external id, all or nothing. */
export const POST = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "owner");
  const text = await req.text();
  if (text.length > limits.batchMaxBytes) throw new AppError("too_large:body", `The batch is over ${limits.batchMaxBytes} bytes; send fewer items per request.`);
  const { items, columns } = parseBatchBody(text, req.headers.get("content-type") ?? "application/json");
  const result = await importBatch({ projectId, userId: access.user.id, items, columns });
  return json(result, { status: result.created > 0 ? 201 : 200 });
});
