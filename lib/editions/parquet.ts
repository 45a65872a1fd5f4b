import { ParquetWriter, type SchemaElement, fileWriter } from "hyparquet-writer";
import { type FeatureColumnPlan, VOTE_SHARES, featureHeader, labelHeader } from "./columns";
import { type EditionRow, featureText } from "./rows";

const text = (name: string, required = false): SchemaElement => ({ name, type: "BYTE_ARRAY", converted_type: "UTF8", repetition_type: required ? "REQUIRED" : "OPTIONAL" });

/** The Parquet schema of an edition: the CSV's columns, with numbers as DOUBLE, vectors as LIST<FLOAT> and vote shares as JSON. */
export function editionParquetSchema(features: FeatureColumnPlan[], annotators: string[]): SchemaElement[] {
  const cols: SchemaElement[][] = [
    [text("external_id", true)],
    [text("split")],
    [text("final_label")],
    [text("label_source", true)],
    [{ name: "is_blind", type: "BOOLEAN", repetition_type: "REQUIRED" }],
    [{ name: "is_control", type: "BOOLEAN", repetition_type: "REQUIRED" }],
  ];
  for (const c of features) {
    const name = featureHeader(c);
    if (c.kind === "numeric") cols.push([{ name, type: "DOUBLE", repetition_type: "OPTIONAL" }]);
    else if (c.kind === "vector")
      cols.push([
        { name, repetition_type: "OPTIONAL", converted_type: "LIST", num_children: 1 },
        { name: "list", repetition_type: "REPEATED", num_children: 1 },
        { name: "element", type: "FLOAT", repetition_type: "OPTIONAL" },
      ]);
    else cols.push([text(name)]);
  }
  for (const a of annotators) cols.push([text(labelHeader(a))]);
  cols.push([{ name: VOTE_SHARES, type: "BYTE_ARRAY", converted_type: "JSON", repetition_type: "OPTIONAL" }]);
  return [{ name: "root", num_children: cols.length }, ...cols.flat()];
}

type Column = { name: string; data: unknown[]; pick: (row: EditionRow) => unknown };

/** Writes rows to a Parquet file on disk, one row group per `groupRows` rows, so memory holds one group at most. */
export class ParquetSink {
  private readonly writer: ParquetWriter;
  private readonly columns: Column[];
  private pending = 0;
  rows = 0;

  constructor(path: string, features: FeatureColumnPlan[], annotators: string[], private readonly groupRows = 50_000, kv: Record<string, string> = {}) {
    const col = (name: string, pick: (row: EditionRow) => unknown): Column => ({ name, data: [], pick });
    this.columns = [
      col("external_id", (r) => r.external_id),
      col("split", (r) => r.split),
      col("final_label", (r) => r.final_label),
      col("label_source", (r) => r.label_source),
      col("is_blind", (r) => r.is_blind),
      col("is_control", (r) => r.is_control),
      ...features.map((c) =>
        col(featureHeader(c), (r) => {
          const v = r.features[c.name];
          if (c.kind === "numeric") return typeof v === "number" && Number.isFinite(v) ? v : null;
          if (c.kind === "vector") return Array.isArray(v) ? v : null;
          return featureText(v);
        }),
      ),
      ...annotators.map((a) => col(labelHeader(a), (r) => r.labels[a] ?? null)),
      col(VOTE_SHARES, (r) => (Object.keys(r.vote_shares).length ? r.vote_shares : null)),
    ];
    this.writer = new ParquetWriter({
      writer: fileWriter(path),
      schema: editionParquetSchema(features, annotators),
      createdBy: "Vicinal editions",
      kvMetadata: Object.entries(kv).map(([key, value]) => ({ key, value })),
    });
  }

  add(row: EditionRow) {
    for (const c of this.columns) c.data.push(c.pick(row));
    this.pending += 1;
    this.rows += 1;
    if (this.pending >= this.groupRows) this.flush();
  }

  private flush() {
    if (this.pending === 0) return;
    this.writer.write({ columnData: this.columns.map((c) => ({ name: c.name, data: c.data as never })), rowGroupSize: this.pending });
    for (const c of this.columns) c.data = [];
    this.pending = 0;
  }

  close() {
    this.flush();
    this.writer.finish();
  }
}
