import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { imports } from "@/db/schema";

/** Writes progress at most every `everyMs` and reads the cancel flag (outside the import's own transaction). */
export class ProgressReporter {
  private last = 0;
  cancelled = false;

  constructor(private readonly importId: string, private readonly everyMs = 500) {}

  async tick(rowsDone: number, rowsTotal: number | null, force = false) {
    const now = Date.now();
    if (!force && now - this.last < this.everyMs) return this.cancelled;
    this.last = now;
    const [row] = await db
      .update(imports)
      .set({ rowsDone, rowsTotal: rowsTotal === null ? sql`${imports.rowsTotal}` : Math.round(rowsTotal) })
      .where(eq(imports.id, this.importId))
      .returning({ cancel: imports.cancelRequested });
    this.cancelled = row?.cancel ?? false;
    return this.cancelled;
  }
}
