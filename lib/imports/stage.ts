import { finished } from "node:stream/promises";
import type { PoolClient } from "pg";
import { from as copyFrom } from "pg-copy-streams";
import { BinaryCopyWriter } from "./copy-binary";
import type { StagedItem } from "./types";

const FLUSH_BYTES = 1 << 20;
type CopyStream = NodeJS.WritableStream & { destroy(error?: Error): void };

/**
 * All-or-nothing writes: one transaction on one connection, holding the project row lock so imports into a
 * project run one at a time. Into a project with no items yet, rows are COPYed (binary) straight into `items`:
 * nothing can conflict and ids are unique within the file (checked before writing). Otherwise rows are COPYed into
 * a temporary staging table and moved by one INSERT … SELECT … ON CONFLICT (project_id, external_id) DO NOTHING,
 * so items already present are skipped. A failed or cancelled import rolls back to zero items either way.
 */
export class ItemStager {
  private writer = new BinaryCopyWriter();
  private stream: CopyStream;
  private failure: Error | null = null;
  staged = 0;

  private constructor(
    private readonly client: PoolClient,
    private readonly direct: boolean,
    private readonly projectId: number,
    private readonly importId: string | null,
  ) {
    const sql = direct
      ? "COPY items (project_id, external_id, fields, vector, import_id, prior_class_id, image_key, thumb_key) FROM STDIN (FORMAT binary)"
      : "COPY import_stage (row_no, external_id, fields, vector, prior_class_id, image_key, thumb_key) FROM STDIN (FORMAT binary)";
    this.stream = client.query(copyFrom(sql)) as unknown as CopyStream;
    this.stream.on("error", (error: Error) => {
      this.failure = error;
    });
  }

  static async begin(client: PoolClient, projectId: number, importId: string | null): Promise<ItemStager> {
    await client.query("BEGIN");
    await client.query("SELECT id FROM projects WHERE id = $1 FOR UPDATE", [projectId]);
    const { rows } = await client.query("SELECT EXISTS (SELECT 1 FROM items WHERE project_id = $1) AS any", [projectId]);
    const direct = !rows[0].any;
    if (!direct) {
      await client.query(
        `CREATE TEMP TABLE import_stage (row_no int4 NOT NULL, external_id text NOT NULL, fields jsonb NOT NULL, vector bytea,
          prior_class_id int4, image_key text, thumb_key text) ON COMMIT DROP`,
      );
    }
    return new ItemStager(client, direct, projectId, importId);
  }

  async write(item: StagedItem) {
    const w = this.writer;
    let json = "{}";
    for (const _ in item.fields) {
      json = JSON.stringify(item.fields);
      break;
    }
    if (this.direct) {
      w.startRow(8);
      w.int4(this.projectId);
      w.text(item.externalId);
      w.jsonb(json);
      w.float32Bytes(item.vector);
      w.uuid(this.importId);
    } else {
      w.startRow(7);
      w.int4(item.row);
      w.text(item.externalId);
      w.jsonb(json);
      w.float32Bytes(item.vector);
    }
    w.int4(item.priorClassId);
    w.text(item.imageKey ?? null);
    w.text(item.thumbKey ?? null);
    this.staged += 1;
    if (w.size >= FLUSH_BYTES) await this.flush(false);
  }

  private async flush(final: boolean) {
    if (this.failure) throw this.failure;
    const chunk = this.writer.take(final);
    if (!this.stream.write(chunk) && !this.failure) {
      await new Promise<void>((resolve) => {
        const done = () => {
          this.stream.removeListener("drain", done);
          this.stream.removeListener("error", done);
          resolve();
        };
        this.stream.on("drain", done);
        this.stream.on("error", done);
      });
    }
    if (this.failure) throw this.failure;
  }

  /** Ends the COPY and, when staged, moves the rows into items; returns how many are new. Does not commit. */
  async finish(): Promise<{ created: number; staged: number }> {
    await this.flush(true);
    this.stream.end();
    await finished(this.stream);
    if (this.failure) throw this.failure;
    if (this.direct) return { created: this.staged, staged: this.staged };
    // The staging table is scanned in insertion order, so `seq` follows the file's row order.
    await this.client.query("SET LOCAL synchronize_seqscans = off");
    const res = await this.client.query(
      `INSERT INTO items (project_id, external_id, fields, vector, import_id, prior_class_id, image_key, thumb_key)
       SELECT $1, external_id, fields, vector, $2, prior_class_id, image_key, thumb_key FROM import_stage
       ON CONFLICT (project_id, external_id) DO NOTHING`,
      [this.projectId, this.importId],
    );
    return { created: res.rowCount ?? 0, staged: this.staged };
  }

  /** Abandons the COPY; the caller releases the connection as broken, which rolls the transaction back. */
  async rollback() {
    try {
      this.stream.destroy(new Error("import stopped"));
    } catch {
      /* already closed */
    }
    await this.client.query("ROLLBACK").catch(() => undefined);
  }
}
