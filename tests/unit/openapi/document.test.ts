import { Validator } from "@seriousme/openapi-schema-validator";
import { describe, expect, it } from "vitest";
import { createEditionSchema } from "@/app/api/v1/projects/[projectId]/editions/schema";
import { apiGroups, buildOpenApiDocument } from "@/lib/openapi/document";
import { errorCatalogue, statusOfCode } from "@/lib/openapi/errors";
import { routeHandlersOnDisk } from "@/tests/support/routes";

const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"];

/** Every exported handler under app/api/v1 on disk, as "METHOD /api/v1/…/{param}" (the walk the route matrix uses). */
function handlersOnDisk(): string[] {
  return routeHandlersOnDisk("app/api/v1").map((r) => r.replace(/\[(\w+)\]/g, "{$1}"));
}

const doc = buildOpenApiDocument();
const documented = Object.entries(doc.paths ?? {}).flatMap(([p, item]) => Object.keys(item as object).filter((k) => methods.includes(k.toUpperCase())).map((m) => `${m.toUpperCase()} ${p}`)).sort();

async function validate(document: unknown) {
  const validator = new Validator();
  return validator.validate(JSON.parse(JSON.stringify(document)));
}

describe("the OpenAPI description", () => {
  it("covers every route handler under app/api/v1, and nothing that is not on disk", () => {
    const disk = handlersOnDisk();
    expect(disk.length).toBeGreaterThan(40);
    expect(disk.filter((h) => !documented.includes(h)), "handlers missing from the document").toEqual([]);
    expect(documented.filter((h) => !disk.includes(h)), "documented operations with no handler").toEqual([]);
  });

  it("validates as OpenAPI 3.1 with @seriousme/openapi-schema-validator", async () => {
    const res = await validate(doc);
    expect(res.errors ?? []).toEqual([]);
    expect(res.valid).toBe(true);
    expect(doc.openapi).toBe("3.1.0");
  });

  it("a deliberately broken copy fails the same validator", async () => {
    const broken = JSON.parse(JSON.stringify(doc));
    delete broken.info;
    expect((await validate(broken)).valid).toBe(false);
    const badResponse = JSON.parse(JSON.stringify(doc));
    badResponse.paths["/api/v1/me"].get.responses = { 200: { content: {} } }; // a response without its required description
    expect((await validate(badResponse)).valid).toBe(false);
    const badParam = JSON.parse(JSON.stringify(doc));
    badParam.paths["/api/v1/projects"].get.parameters[0].in = "body"; // "body" is not a 3.1 parameter location
    expect((await validate(badParam)).valid).toBe(false);
  });

  it("every $ref points at a component that exists", () => {
    const text = JSON.stringify(doc);
    const refs = [...text.matchAll(/"\$ref":"#\/components\/schemas\/([^"]+)"/g)].map((m) => m[1]);
    expect(refs.length).toBeGreaterThan(10);
    for (const r of new Set(refs)) expect(doc.components?.schemas?.[r], r).toBeTruthy();
  });

  it("declares the bearer token and the session cookie; only openapi.json is public, token creation is session-only", () => {
    expect(doc.components?.securitySchemes?.bearerToken).toMatchObject({ type: "http", scheme: "bearer" });
    expect(doc.components?.securitySchemes?.sessionCookie).toMatchObject({ type: "apiKey", in: "cookie" });
    expect(doc.security).toEqual([{ bearerToken: [] }, { sessionCookie: [] }]);
    const publicOps = documented.filter((h) => {
      const [m, p] = h.split(" ");
      return (doc.paths as any)[p][m.toLowerCase()].security?.length === 0;
    });
    expect(publicOps).toEqual(["GET /api/v1/openapi.json"]);
    expect((doc.paths as any)["/api/v1/tokens"].post.security).toEqual([{ sessionCookie: [] }]);
  });

  it("takes request bodies and query parameters from the routes' own zod schemas", () => {
    const post = (doc.paths as any)["/api/v1/projects/{projectId}/editions"].post;
    const body = post.requestBody.content["application/json"].schema;
    expect(Object.keys(body.properties).sort()).toEqual(Object.keys(createEditionSchema.shape).sort());
    expect(body.properties.include.items.enum).toEqual(["agreed", "ruling", "single", "control", "disputed"]);
    const labels = (doc.paths as any)["/api/v1/projects/{projectId}/labels"].get.parameters;
    expect(labels.map((p: { in: string; name: string }) => `${p.in}:${p.name}`)).toEqual(["path:projectId", "query:since", "query:limit"]);
    expect(labels[2].schema).toMatchObject({ minimum: 1, maximum: 5000, default: 1000 });
  });

  it("answers every operation's error codes with the shared Error schema under the right status", () => {
    const op = (doc.paths as any)["/api/v1/projects/{projectId}/items/{itemId}/labels"].post;
    expect(op["x-vicinal-role"]).toBe("annotator");
    expect(op.responses["409"].description).toContain("conflict:already_labelled");
    expect(op.responses["422"].description).toContain("bad_request:validation");
    expect(op.responses["404"].content["application/json"].schema).toEqual({ $ref: "#/components/schemas/Error" });
    expect(doc.components?.schemas?.Error).toMatchObject({ required: ["error"] });
    for (const code of Object.keys(errorCatalogue)) expect(statusOfCode(code), code).toBeGreaterThanOrEqual(400);
    expect(statusOfCode("forbidden:role")).toBe(403);
    expect(statusOfCode("bad_request:validation")).toBe(422);
  });

  it("documents cursor paging on the listings", () => {
    const paged = apiGroups.flatMap((g) => g.operations).filter((o) => o.paged === "cursor").map((o) => o.path);
    expect(paged).toEqual(expect.arrayContaining(["/api/v1/projects", "/api/v1/projects/{projectId}/items", "/api/v1/projects/{projectId}/editions"]));
    const items = (doc.paths as any)["/api/v1/projects/{projectId}/items"].get;
    expect(items.description).toMatch(/cursor/);
    expect(items.parameters.find((p: { name: string }) => p.name === "cursor").description).toMatch(/nextCursor/);
  });
});
