import { type Components, exampleOf, type JsonSchema } from "./schema-text";

export type DocOperation = {
  method: string;
  path: string;
  operationId: string;
  summary?: string;
  description?: string;
  parameters?: Array<{ in: string; name: string; required?: boolean; description?: string; schema?: JsonSchema }>;
  requestBody?: { content: Record<string, { schema?: JsonSchema }> };
  responses: Record<string, { description: string; content?: Record<string, { schema?: JsonSchema }> }>;
  security?: unknown[];
  "x-vicinal-role"?: string;
  "x-vicinal-error-codes"?: string[];
};

const envName = (param: string) => `$${param.replace(/([a-z])([A-Z])/g, "$1_$2").toUpperCase()}`;

/** A copy-paste curl call: token from $VICINAL_TOKEN, path ids as shell variables, an example JSON body. */
export function curlExample(op: DocOperation, baseUrl: string, components: Components): string {
  const path = op.path.replace(/\{(\w+)\}/g, (_m, name: string) => envName(name));
  const required = (op.parameters ?? []).filter((p) => p.in === "query" && p.required);
  const query = required.length ? `?${required.map((p) => `${p.name}=${envName(p.name)}`).join("&")}` : "";
  const lines = [`curl -sS${op.method === "get" ? "" : ` -X ${op.method.toUpperCase()}`} "${baseUrl}${path}${query}"`];
  const sessionOnly = Array.isArray(op.security) && op.security.length === 1 && JSON.stringify(op.security).includes("sessionCookie");
  if (op.security?.length !== 0 && !sessionOnly) lines.push(`-H "Authorization: Bearer $VICINAL_TOKEN"`);
  if (sessionOnly) lines.push(`-H "Cookie: authjs.session-token=$SESSION"`);
  const json = op.requestBody?.content["application/json"]?.schema;
  if (json) {
    lines.push(`-H "Content-Type: application/json"`);
    const body = JSON.stringify(exampleOf(json, components)).replace(/'/g, "'\\''");
    lines.push(`-d '${body}'`);
  }
  return lines.join(" \\\n  ");
}
