import { readFile } from "node:fs/promises";
import Papa from "papaparse";
import { z } from "zod";
import { AgreementInputError, computeAgreement, encodeRatings, type RatingRow } from "@/lib/agreement";
import { CliError, parseFlags } from "../errors";

const REQUIRED = ["item", "annotator", "label"] as const;

const flagsSchema = z.object({
  labels: z.string().min(1),
  resamples: z.coerce.number().int().min(0).max(100_000).default(1000),
  seed: z.coerce.number().int().default(1),
});

async function readRows(path: string): Promise<RatingRow[]> {
  let text: string;
  try {
    text = await readFile(path, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new CliError(`cannot read '${path}'${code === "ENOENT" ? ": no such file" : code ? ` (${code})` : ""}`);
  }
  text = text.replace(/^\uFEFF/, "");
  if (text.trim() === "") throw new CliError(`'${path}' is empty: expected a header line 'item,annotator,label' and rows`);
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: "greedy", transformHeader: (h) => h.trim() });
  const fields = parsed.meta.fields ?? [];
  const missing = REQUIRED.filter((name) => !fields.includes(name));
  if (missing.length > 0) {
    throw new CliError(`'${path}' lacks column${missing.length > 1 ? "s" : ""} ${missing.map((m) => `'${m}'`).join(", ")} (found: ${fields.join(", ") || "none"})`);
  }
  const fatal = parsed.errors.find((e) => e.type !== "FieldMismatch" || e.code === "TooFewFields");
  if (fatal) throw new CliError(`'${path}' row ${(fatal.row ?? 0) + 2}: ${fatal.message}`);
  if (parsed.data.length === 0) throw new CliError(`'${path}' has a header but no rating rows`);
  return parsed.data.map((record, index) => {
    const row = { item: (record.item ?? "").trim(), annotator: (record.annotator ?? "").trim(), label: (record.label ?? "").trim() };
    for (const name of REQUIRED) {
      if (row[name] === "") throw new CliError(`'${path}' row ${index + 2}: empty '${name}' (leave out the row for a missing rating)`);
    }
    return row;
  });
}

/** `agreement --labels F.csv [--resamples 1000] [--seed 1]`: prints one JSON object of agreement figures. */
export async function runAgreement(args: string[]): Promise<void> {
  const flags = flagsSchema.safeParse(parseFlags(args, ["labels", "resamples", "seed"]));
  if (!flags.success) {
    const issue = flags.error.issues[0];
    throw new CliError(issue.path[0] === "labels" ? "missing --labels F.csv" : `bad --${String(issue.path[0])}: ${issue.message}`);
  }
  const { labels, resamples, seed } = flags.data;
  const rows = await readRows(labels);
  let encoded;
  try {
    encoded = encodeRatings(rows);
  } catch (error) {
    if (error instanceof AgreementInputError) throw new CliError(error.message);
    throw error;
  }
  const report = computeAgreement(encoded.input, { resamples, seed });
  const { annotators, classes } = encoded;
  const output = {
    items: report.items,
    annotators: report.annotators,
    ratings: report.ratings,
    classes: classes.length,
    repeatedRowsIgnored: encoded.repeatedRows,
    percentAgreement: report.percentAgreement.value,
    percentAgreementCi95: report.percentAgreement.ci95,
    cohenKappa: report.cohenKappa.map((pair) => ({
      a: annotators[pair.a],
      b: annotators[pair.b],
      n: pair.n,
      kappa: pair.kappa.value,
      ci95: pair.kappa.ci95,
      band: pair.kappa.band,
    })),
    fleissKappa: {
      value: report.fleissKappa.value,
      items: report.fleissKappa.items,
      ratersPerItem: report.fleissKappa.ratersPerItem,
      ci95: report.fleissKappa.ci95,
      band: report.fleissKappa.band,
    },
    krippendorffAlpha: report.krippendorffAlpha.value,
    krippendorffAlphaCi95: report.krippendorffAlpha.ci95,
    band: report.band,
    reading: report.reading,
    perClass: report.perClass.map((c) => ({ class: classes[c.class], ratings: c.ratings, alpha: c.alpha.value, ci95: c.alpha.ci95, band: c.alpha.band })),
    perAnnotator: report.perAnnotator.map((a) => ({
      annotator: annotators[a.annotator],
      ratings: a.ratings,
      sharedItems: a.sharedItems,
      kappaVsOthers: a.kappaVsOthers.value,
      ci95: a.kappaVsOthers.ci95,
      band: a.kappaVsOthers.band,
    })),
    bootstrap: report.bootstrap,
  };
  process.stdout.write(`${JSON.stringify(output)}\n`);
}
