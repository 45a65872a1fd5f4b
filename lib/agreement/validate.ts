import { z } from "zod";
import type { AgreementInput, AgreementOptions } from "./types";

/** Input that cannot be analysed: wrong lengths, out-of-range indices, a duplicate (item, annotator) rating. */
export class AgreementInputError extends Error {}

export const agreementOptionsSchema = z.object({
  resamples: z.number().int().min(0).max(100_000).default(1000),
  seed: z.number().int().default(1),
  detailIntervals: z.boolean().default(true),
});

export type ResolvedOptions = z.infer<typeof agreementOptionsSchema>;

export function resolveOptions(options: AgreementOptions | undefined): ResolvedOptions {
  const parsed = agreementOptionsSchema.safeParse(options ?? {});
  if (!parsed.success) throw new AgreementInputError(`bad options: ${z.prettifyError(parsed.error)}`);
  return parsed.data;
}

const count = z.number().int().min(0).max(2 ** 31 - 1);
const shapeSchema = z.object({
  itemCount: count,
  annotatorCount: count,
  classCount: count,
  item: z.instanceof(Int32Array),
  annotator: z.instanceof(Int32Array),
  label: z.instanceof(Int32Array),
  finalLabel: z.instanceof(Int32Array).optional(),
  controlLabel: z.instanceof(Int32Array).optional(),
  tookSuggestion: z.instanceof(Uint8Array).optional(),
  blind: z.instanceof(Uint8Array).optional(),
  suggestionTop: z.instanceof(Int32Array).optional(),
});

function checkRange(name: string, values: Int32Array, limit: number, allowMissing: boolean): void {
  const min = allowMissing ? -1 : 0;
  for (let i = 0; i < values.length; i += 1) {
    const v = values[i];
    if (v < min || v >= limit) {
      throw new AgreementInputError(`${name}[${i}] = ${v} is outside ${min}..${limit - 1}`);
    }
  }
}

function checkLength(name: string, values: { length: number } | undefined, expected: number): void {
  if (values !== undefined && values.length !== expected) {
    throw new AgreementInputError(`${name} has length ${values.length}, expected ${expected}`);
  }
}

export function validateInput(input: AgreementInput): void {
  const shape = shapeSchema.safeParse(input);
  if (!shape.success) throw new AgreementInputError(`bad input: ${z.prettifyError(shape.error)}`);
  const ratings = input.item.length;
  checkLength("annotator", input.annotator, ratings);
  checkLength("label", input.label, ratings);
  checkLength("tookSuggestion", input.tookSuggestion, ratings);
  checkLength("blind", input.blind, ratings);
  checkLength("suggestionTop", input.suggestionTop, ratings);
  checkLength("finalLabel", input.finalLabel, input.itemCount);
  checkLength("controlLabel", input.controlLabel, input.itemCount);
  checkRange("item", input.item, input.itemCount, false);
  checkRange("annotator", input.annotator, input.annotatorCount, false);
  checkRange("label", input.label, input.classCount, false);
  if (input.finalLabel) checkRange("finalLabel", input.finalLabel, input.classCount, true);
  if (input.controlLabel) checkRange("controlLabel", input.controlLabel, input.classCount, true);
  if (input.suggestionTop) checkRange("suggestionTop", input.suggestionTop, input.classCount, true);
}
