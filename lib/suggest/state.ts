import { pool } from "@/db";
import { AppError } from "@/lib/errors";
import { projectSettingsSchema, type FeatureSchema, type ProjectSettings } from "@/lib/projects/settings";

/** What a process reads before answering: one query over knn_state, the project and its label set. */
export type EngineState = {
  projectId: number;
  version: number;
  settingsHash: string;
  settings: ProjectSettings;
  schema: FeatureSchema | null;
  maxSeq: number;
  classIds: number[];
  classColours: string[];
  classNames: string[];
  /** The database clock when the state was read (the sync point for incremental updates). */
  now: Date;
};

export async function readEngineState(projectId: number): Promise<EngineState> {
  for (let attempt = 0; attempt < 2; attempt += 1) {
    const res = await pool.query(
      `select ks.version::text as version, ks.settings_hash, p.settings, p.feature_schema, statement_timestamp() as now,
         coalesce((select max(seq) from items where project_id = p.id), 0)::text as max_seq,
         coalesce((select json_agg(json_build_array(c.id, c.colour, c.name) order by c.position, c.id) from label_classes c where c.project_id = p.id), '[]') as classes
       from projects p left join knn_state ks on ks.project_id = p.id where p.id = $1`,
      [projectId],
    );
    const row = res.rows[0];
    if (!row) throw new AppError("not_found:project", "No such project.");
    if (row.version === null) {
      await pool.query("insert into knn_state (project_id) values ($1) on conflict (project_id) do nothing", [projectId]);
      continue;
    }
    const classes = row.classes as Array<[number, string, string]>;
    return {
      projectId,
      version: Number(row.version),
      settingsHash: row.settings_hash as string,
      settings: projectSettingsSchema.parse(row.settings),
      schema: (row.feature_schema as FeatureSchema | null) ?? null,
      maxSeq: Number(row.max_seq),
      classIds: classes.map((c) => c[0]),
      classColours: classes.map((c) => c[1]),
      classNames: classes.map((c) => c[2]),
      now: row.now as Date,
    };
  }
  throw new AppError("not_found:project", "No such project.");
}
