import { fieldViews } from "./format";
import type { DeskColumn } from "./types";

/** An item's fields laid out to be read at a glance: measurements as tiles with units, categories and text below. */
export function ItemFields({ fields, columns, imageUrl, externalId }: { fields: Record<string, unknown>; columns: DeskColumn[]; imageUrl: string | null; externalId: string }) {
  const views = fieldViews(fields, columns);
  const numbers = views.filter((v) => v.kind === "number" || v.kind === "missing");
  const others = views.filter((v) => v.kind !== "number" && v.kind !== "missing");
  return (
    <div className="space-y-4">
      {imageUrl ? (
        // eslint-disable-next-line @next/next/no-img-element -- presigned object-storage URL, not a static asset
        <img src={imageUrl} alt={`Item ${externalId}`} className="max-h-80 w-full rounded-md border border-line bg-paper-sunk object-contain" />
      ) : null}
      {numbers.length ? (
        <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4">
          {numbers.map((v) => (
            <div key={v.name} className="rounded-md border border-line bg-paper px-3 py-2">
              <dt className="truncate text-xs font-semibold text-ink-soft" title={v.name}>
                {v.title}
              </dt>
              <dd className="mt-0.5 flex items-baseline gap-1">
                {v.kind === "missing" ? (
                  <span className="text-sm italic text-ink-faint">missing</span>
                ) : (
                  <>
                    <span className="num text-xl font-semibold text-ink">{v.value}</span>
                    {v.unit ? <span className="text-xs text-ink-faint">{v.unit}</span> : null}
                  </>
                )}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
      {others.length ? (
        <dl className="space-y-2 text-sm">
          {others.map((v) => (
            <div key={v.name} className={v.kind === "text" ? "" : "flex items-baseline gap-3"}>
              <dt className="min-w-28 text-xs font-semibold text-ink-soft">{v.title}</dt>
              <dd className={v.kind === "text" ? "mt-1 whitespace-pre-wrap rounded-md border border-line bg-paper px-3 py-2 leading-relaxed text-ink" : ""}>
                {v.kind === "category" ? <span className="rounded-full bg-paper-sunk px-2.5 py-0.5 font-semibold text-ink">{v.value}</span> : v.kind === "list" ? <span className="text-ink-faint">{v.value}</span> : v.value}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
    </div>
  );
}
