import { pool } from "@/db";
import { AppError } from "@/lib/errors";
import { projectSettingsSchema, type FeatureSchema, type ProjectSettings } from "@/lib/projects/settings";
import { engineSettingsHash } from "./engine-settings";

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
  /** Changes exactly when the engine settings, the label set or the feature schema change. */
  shapeKey: string;
  /** The database clock when the state was read (the sync point for incremental updates). */
  now: Date;
};

type Shape = Pick<EngineState, "settings" | "schema" | "classIds" | "classColours" | "classNames"> & { key: string };

/** The last parsed settings / feature schema / label set per project, keyed by their text: parsed again only when they change. */
const shapes = new Map<number, { text: string; shape: Shape }>();

function shapeOf(projectId: number, settingsText: string, schemaText: string | null, classesText: string): Shape {
  const text = `${settingsText}\u0000${schemaText ?? ""}\u0000${classesText}`;
  const known = shapes.get(projectId);
  if (known && known.text === text) return known.shape;
  const settings = projectSettingsSchema.parse(JSON.parse(settingsText));
  const schema = schemaText ? (JSON.parse(schemaText) as FeatureSchema) : null;
  const classes = JSON.parse(classesText) as Array<[number, string, string]>;
  const classIds = classes.map((c) => c[0]);
  const key = [engineSettingsHash(settings), classIds.join(","), schema?.dimension ?? 0, JSON.stringify(schema?.columns ?? [])].join("|");
  const shape = { settings, schema, classIds, classColours: classes.map((c) => c[1]), classNames: classes.map((c) => c[2]), key };
  shapes.set(projectId, { text, shape });
  return shape;
}

/**
 * One round trip before every answer (a named statement, so PostgreSQL plans it once per connection). The JSON columns
 * travel as text and are parsed only when they differ from the last read.
 */
export async function readEngineState(projectId: number): Promise<EngineState> {
  for (let attempt = 0; attempt < 2; attempt += 1) {
    const res = await pool.query({
      name: "vicinal_engine_state",
      text: `select ks.version::text as version, ks.settings_hash, p.settings::text as settings, p.feature_schema::text as feature_schema, statement_timestamp() as now,
         coalesce((select max(seq) from items where project_id = p.id), 0)::text as max_seq,
         coalesce((select json_agg(json_build_array(c.id, c.colour, c.name) order by c.position, c.id) from label_classes c where c.project_id = p.id), '[]')::text as classes
       from projects p left join knn_state ks on ks.project_id = p.id where p.id = $1`,
      values: [projectId],
    });
    const row = res.rows[0];
    if (!row) throw new AppError("not_found:project", "No such project.");
    if (row.version === null) {
      await pool.query("insert into knn_state (project_id) values ($1) on conflict (project_id) do nothing", [projectId]);
      continue;
    }
    const shape = shapeOf(projectId, row.settings as string, (row.feature_schema as string | null) ?? null, row.classes as string);
    return {
      projectId,
      version: Number(row.version),
      settingsHash: row.settings_hash as string,
      settings: shape.settings,
      schema: shape.schema,
      maxSeq: Number(row.max_seq),
      classIds: shape.classIds,
      classColours: shape.classColours,
      classNames: shape.classNames,
      shapeKey: shape.key,
      now: row.now as Date,
    };
  }
  throw new AppError("not_found:project", "No such project.");
}
