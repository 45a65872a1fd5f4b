import { getItemById } from "@/db/queries/items";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route } from "@/lib/http/route";
import { featuresForDisplay } from "@/lib/imports/display";
import { presignGet } from "@/lib/storage/s3";

/** One item with everything known about it: fields, features, image, labels and disputes. */
export const GET = route<{ projectId: string; itemId: string }>(async (_req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "viewer");
  const itemId = parseId(params.itemId, "item");
  const { item, labels, disputes } = await getItemById({ projectId, itemId });
  return json({
    item: {
      id: item.id,
      externalId: item.externalId,
      status: item.status,
      isControl: item.isControl,
      labelCount: item.labelCount,
      finalClassId: item.finalClassId,
      finalSource: item.finalSource,
      priorClassId: item.priorClassId,
      poolTopClassId: item.poolTopClassId,
      poolTopShare: item.poolTopShare,
      importId: item.importId,
      createdAt: item.createdAt,
      fields: item.fields,
      features: featuresForDisplay(access.project.featureSchema ?? null, item.vector ?? null),
      imageUrl: item.imageKey ? await presignGet(item.imageKey) : null,
      thumbUrl: item.thumbKey ? await presignGet(item.thumbKey) : null,
    },
    labels,
    disputes,
  });
});
