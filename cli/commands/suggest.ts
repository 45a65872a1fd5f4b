import { z } from "zod";
import { ExactIndex, distances, fitPreprocessor, scalings, suggest, transformTable, weightings } from "@/lib/knn";
import { TableError, planFeatures, toTableInput } from "@/lib/knn/table";
import { readCsv, readLabelled, requireColumn } from "../csv";
import { CliError, parseFlags } from "../errors";

const flagsSchema = z.object({
  labelled: z.string().min(1),
  items: z.string().min(1),
  k: z.coerce.number().int().positive().default(5),
  distance: z.enum(distances).default("euclidean"),
  scaling: z.enum(scalings).default("zscore"),
  weighting: z.enum(weightings).default("uniform"),
  "id-column": z.string().min(1).default("id"),
  "label-column": z.string().min(1).default("label"),
});

export function parseOptions<S extends z.ZodType>(schema: S, flags: Record<string, string>): z.infer<S> {
  const parsed = schema.safeParse(flags);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const name = issue.path.join(".");
    throw new CliError(issue.code === "invalid_type" && flags[name] === undefined ? `option '--${name}' is required` : `option '--${name}': ${issue.message}`);
  }
  return parsed.data;
}

/** Suggestions for every row of the items file from the labelled file: one JSON object per line. */
export async function runSuggest(args: string[]): Promise<void> {
  const o = parseOptions(flagsSchema, parseFlags(args, Object.keys(flagsSchema.shape)));
  const idCol = o["id-column"];
  const labelCol = o["label-column"];
  const labelled = readLabelled(o.labelled, idCol, labelCol);
  const items = readCsv(o.items);
  requireColumn(items, idCol, o.items, "id");
  const features = planFeatures(labelled.table.columns, labelled.table.rows, [idCol, labelCol]);
  if (features.length === 0) throw new CliError(`${o.labelled} has no feature columns besides '${idCol}' and '${labelCol}'`);
  const missing = features.filter((f) => !items.columns.includes(f.name)).map((f) => f.name);
  const extra = items.columns.filter((c) => c !== idCol && c !== labelCol && !features.some((f) => f.name === c));
  if (missing.length > 0 || extra.length > 0) {
    throw new CliError(
      `${o.items} columns do not match ${o.labelled}` +
        (missing.length > 0 ? `; missing: ${missing.join(", ")}` : "") +
        (extra.length > 0 ? `; not in the labelled file: ${extra.join(", ")}` : ""),
    );
  }
  if (items.columns.includes(labelCol)) {
    items.rows.forEach((r, i) => {
      const l = (r[labelCol] ?? "").trim();
      if (l !== "" && !labelled.classes.includes(l)) {
        throw new CliError(`${o.items} row ${i + 2}: unknown class '${l}' (label set: ${labelled.classes.join(", ")})`);
      }
    });
  }
  let x: Float32Array;
  let q: Float32Array;
  let dim: number;
  try {
    const train = toTableInput(features, labelled.table.rows, o.labelled);
    const state = fitPreprocessor(train, o.scaling);
    x = transformTable(state, train);
    q = transformTable(state, toTableInput(features, items.rows, o.items));
    dim = state.width;
  } catch (error) {
    if (error instanceof TableError) throw new CliError(error.message);
    throw error;
  }
  const index = ExactIndex.from(x, dim, labelled.classIndex, o.distance);
  const lines: string[] = [];
  for (let i = 0; i < items.rows.length; i += 1) {
    const s = suggest(index, q.subarray(i * dim, (i + 1) * dim), { k: o.k, numClasses: labelled.classes.length, weighting: o.weighting });
    const shares: Record<string, number> = {};
    labelled.classes.forEach((c, j) => (shares[c] = s.shares[j]));
    lines.push(
      JSON.stringify({
        id: items.rows[i][idCol],
        label: s.top >= 0 ? labelled.classes[s.top] : null,
        shares,
        neighbours: s.neighbours.map((n) => ({ id: labelled.ids[n.id], label: labelled.classes[n.classIndex], distance: n.distance })),
      }),
    );
    if (lines.length >= 1000) {
      process.stdout.write(`${lines.join("\n")}\n`);
      lines.length = 0;
    }
  }
  if (lines.length > 0) process.stdout.write(`${lines.join("\n")}\n`);
}
