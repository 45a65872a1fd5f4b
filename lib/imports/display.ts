import type { FeatureSchema } from "@/lib/projects/settings";
import { unpackVector } from "./copy-binary";

export type FeatureValue = { name: string; kind: "numeric" | "vector"; value: number | null; values?: Array<number | null>; width?: number };

/** Reads an item's packed vector back into named values (NaN shows as null, i.e. missing); vectors show their first 16 numbers. */
export function featuresForDisplay(schema: FeatureSchema | null, bytes: Uint8Array | null): FeatureValue[] {
  if (!schema || !bytes) return [];
  const v = unpackVector(bytes);
  const out: FeatureValue[] = [];
  let at = 0;
  const clean = (x: number) => (Number.isNaN(x) ? null : x);
  for (const c of schema.columns) {
    if (c.kind === "numeric") out.push({ name: c.name, kind: "numeric", value: clean(v[at]) });
    if (c.kind === "vector") out.push({ name: c.name, kind: "vector", value: null, width: c.width, values: Array.from(v.subarray(at, at + Math.min(c.width, 16)), clean) });
    at += c.width;
  }
  return out;
}
