// Reading the generated OpenAPI document for display: JSON Schema in, short human labels out.
export type Json = Record<string, unknown>;
export type JsonSchema = {
  $ref?: string;
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  default?: unknown;
  description?: string;
  example?: unknown;
  format?: string;
  pattern?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  additionalProperties?: boolean | JsonSchema;
};

export type Components = Record<string, JsonSchema>;

const refName = (ref: string) => ref.split("/").pop() ?? ref;

export function resolve(schema: JsonSchema | undefined, components: Components): JsonSchema {
  if (!schema) return {};
  if (schema.$ref) return resolve(components[refName(schema.$ref)], components);
  return schema;
}

/** "integer", "array of ItemRow", "string | null". */
export function typeLabel(schema: JsonSchema | undefined, components: Components): string {
  if (!schema) return "any";
  if (schema.$ref) return refName(schema.$ref);
  const alts = schema.anyOf ?? schema.oneOf;
  if (alts) return alts.map((a) => typeLabel(a, components)).join(" | ");
  if (schema.const !== undefined) return JSON.stringify(schema.const);
  const types = Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : [];
  const label = types.map((t) => (t === "array" ? `array of ${typeLabel(schema.items, components)}` : t === "object" && schema.additionalProperties && typeof schema.additionalProperties === "object" && Object.keys(schema.additionalProperties).length ? `map of ${typeLabel(schema.additionalProperties, components)}` : t));
  return label.join(" | ") || "any";
}

const big = (n: number) => Math.abs(n) >= 9_000_000_000_000_000;

/** Constraints worth a reader's eye: allowed values, range, length, default. */
export function constraints(schema: JsonSchema): string[] {
  const out: string[] = [];
  if (schema.enum) out.push(`one of ${schema.enum.map((v) => JSON.stringify(v)).join(", ")}`);
  if (schema.format) out.push(schema.format);
  const min = schema.minimum ?? (schema.exclusiveMinimum !== undefined ? `> ${schema.exclusiveMinimum}` : undefined);
  if (min !== undefined && !(typeof min === "number" && big(min))) out.push(`min ${min}`);
  if (schema.maximum !== undefined && !big(schema.maximum)) out.push(`max ${schema.maximum}`);
  if (schema.minLength !== undefined) out.push(`≥ ${schema.minLength} chars`);
  if (schema.maxLength !== undefined) out.push(`≤ ${schema.maxLength} chars`);
  if (schema.minItems !== undefined) out.push(`≥ ${schema.minItems} entries`);
  if (schema.maxItems !== undefined) out.push(`≤ ${schema.maxItems} entries`);
  if (schema.pattern) out.push(`pattern ${schema.pattern}`);
  if (schema.default !== undefined) out.push(`default ${JSON.stringify(schema.default)}`);
  return out;
}

export type FieldRow = { path: string; type: string; required: boolean; description?: string; notes: string[] };

/** The fields of an object schema, nested objects (and arrays of objects) flattened as `a.b` / `a[].b`. */
export function fieldRows(schema: JsonSchema | undefined, components: Components, prefix = "", depth = 0): FieldRow[] {
  const s = resolve(schema, components);
  const alts = s.anyOf ?? s.oneOf;
  if (alts && depth === 0) {
    const objects = alts.map((a) => resolve(a, components)).filter((a) => a.properties);
    if (objects.length) return objects.flatMap((o) => fieldRows(o, components, prefix, depth));
  }
  if (!s.properties) return [];
  const rows: FieldRow[] = [];
  for (const [name, raw] of Object.entries(s.properties)) {
    const p = resolve(raw, components);
    const path = prefix ? `${prefix}.${name}` : name;
    rows.push({ path, type: typeLabel(raw, components), required: (s.required ?? []).includes(name), description: p.description ?? raw.description, notes: constraints(p) });
    if (depth < 2) {
      const inner = (p.anyOf ?? []).map((a) => resolve(a, components)).find((a) => a.properties) ?? p;
      if (inner.properties && !raw.$ref) rows.push(...fieldRows(inner, components, path, depth + 1));
      else if (inner.type === "array" && inner.items && !inner.items.$ref) rows.push(...fieldRows(inner.items, components, `${path}[]`, depth + 1));
    }
  }
  return rows;
}

/** A plausible request body built from the schema: examples, defaults, first allowed values. */
export function exampleOf(schema: JsonSchema | undefined, components: Components, depth = 0): unknown {
  const s = resolve(schema, components);
  if (s.example !== undefined) return s.example;
  if (s.const !== undefined) return s.const;
  if (s.enum) return s.enum[0];
  const alts = s.anyOf ?? s.oneOf;
  if (alts) return exampleOf(alts.find((a) => resolve(a, components).type !== "null") ?? alts[0], components, depth);
  const type = Array.isArray(s.type) ? s.type.find((t) => t !== "null") : s.type;
  if (type === "object" || s.properties) {
    const out: Json = {};
    for (const [name, p] of Object.entries(s.properties ?? {})) {
      if ((s.required ?? []).includes(name) || (depth === 0 && resolve(p, components).example !== undefined)) out[name] = exampleOf(p, components, depth + 1);
    }
    return out;
  }
  if (type === "array") return [exampleOf(s.items, components, depth + 1)];
  if (s.default !== undefined) return s.default;
  if (type === "integer") return s.minimum && s.minimum > 1 ? s.minimum : 1;
  if (type === "number") return 0.5;
  if (type === "boolean") return true;
  if (s.format === "uuid") return "6f1c2e4a-9b7d-4c3e-8a21-5d0f7b9e3c12";
  return s.minLength && s.minLength > 3 ? "a few words here" : "text";
}
