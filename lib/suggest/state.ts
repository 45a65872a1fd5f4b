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

/** An item as a suggestion needs it, read with the engine state (any project's: the caller checks `projectId`). */
export type StateItem = {
  id: number;
  projectId: number;
  externalId: string;
  vector: Buffer | null;
  fields: Record<string, unknown>;
  imageKey: string | null;
  thumbKey: string | null;
  isControl: boolean;
  isBlind: boolean;
};

const stateText = `select ks.version::text as version, ks.settings_hash, p.settings::text as settings, p.feature_schema::text as feature_schema, statement_timestamp() as now,
     coalesce((select max(seq) from items where project_id = p.id), 0)::text as max_seq,
     coalesce((select json_agg(json_build_array(c.id, c.colour, c.name) order by c.position, c.id) from label_classes c where c.project_id = p.id), '[]')::text as classes`;

/**
 * One round trip before every answer (a named statement, so PostgreSQL plans it once per connection); with `itemId`,
 * the item to answer for comes in the same row (by primary key, whatever its project). The JSON columns travel as text
 * and are parsed only when they differ from the last read.
 */
export async function readEngineState(projectId: number): Promise<EngineState>;
export async function readEngineState(projectId: number, itemId: number): Promise<EngineState & { item: StateItem | null }>;
export async function readEngineState(projectId: number, itemId?: number): Promise<EngineState & { item?: StateItem | null }> {
  for (let attempt = 0; attempt < 2; attempt += 1) {
    const res =
      itemId === undefined
        ? await pool.query({ name: "vicinal_engine_state", text: `${stateText} from projects p left join knn_state ks on ks.project_id = p.id where p.id = $1`, values: [projectId] })
        : await pool.query({
            name: "vicinal_engine_state_item",
            text: `${stateText}, it.id as item_id, it.project_id as item_project_id, it.external_id as item_external_id, it.vector as item_vector, it.fields as item_fields,
                 it.image_key as item_image_key, it.thumb_key as item_thumb_key, it.is_control as item_is_control, it.is_blind as item_is_blind
               from projects p left join knn_state ks on ks.project_id = p.id left join items it on it.id = $2 where p.id = $1`,
            values: [projectId, itemId],
          });
    const row = res.rows[0];
    if (!row) throw new AppError("not_found:project", "No such project.");
    if (row.version === null) {
      await pool.query("insert into knn_state (project_id) values ($1) on conflict (project_id) do nothing", [projectId]);
      continue;
    }
    const shape = shapeOf(projectId, row.settings as string, (row.feature_schema as string | null) ?? null, row.classes as string);
    const item: StateItem | null =
      row.item_id == null
        ? null
        : {
            id: row.item_id,
            projectId: row.item_project_id,
            externalId: row.item_external_id,
            vector: row.item_vector ?? null,
            fields: row.item_fields ?? {},
            imageKey: row.item_image_key ?? null,
            thumbKey: row.item_thumb_key ?? null,
            isControl: row.item_is_control,
            isBlind: row.item_is_blind,
          };
    return {
      ...(itemId === undefined ? {} : { item }),
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
