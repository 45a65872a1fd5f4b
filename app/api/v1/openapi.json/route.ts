import { buildOpenApiDocument } from "@/lib/openapi/document";
import { json, route } from "@/lib/http/route";

let cached: ReturnType<typeof buildOpenApiDocument> | undefined;

/** The OpenAPI 3.1 description of /api/v1, generated from the routes' zod schemas. Public: no sign-in. */
export const GET = route(async () => {
  cached ??= buildOpenApiDocument();
  return json(cached, { headers: { "cache-control": "public, max-age=300", "access-control-allow-origin": "*" } });
});
