import { createHash } from "node:crypto";
import type { ProjectSettings } from "@/lib/projects/settings";

/** Names the engine rules an answer was computed with (stored with each label's suggestion snapshot). */
export const engineVersion = "vicinal-knn/1";

/** The settings that change what the neighbour engine computes. */
export type EngineSettings = Pick<ProjectSettings, "k" | "distance" | "scaling" | "weighting" | "voters">;

export function engineSettingsOf(s: ProjectSettings): EngineSettings {
  return { k: s.k, distance: s.distance, scaling: s.scaling, weighting: s.weighting, voters: [...s.voters] };
}

/** Stable hash of k / distance / scaling / weighting / voters (knn_state.settings_hash). */
export function engineSettingsHash(s: ProjectSettings): string {
  const e = engineSettingsOf(s);
  const canonical = JSON.stringify([e.k, e.distance, e.scaling, e.weighting, [...e.voters].sort()]);
  return createHash("sha256").update(canonical).digest("hex").slice(0, 16);
}

/** Which label sources vote, in the fixed precedence ruling > agreed > single > control. */
export function voterFlags(s: Pick<ProjectSettings, "voters">) {
  const on = new Set(s.voters);
  return { ruling: on.has("ruling"), agreed: on.has("agreed"), single: on.has("single"), control: on.has("control") };
}
