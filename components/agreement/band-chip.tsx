import type { BandName } from "@/lib/agreement";
import { bandTone } from "./format";

export function BandChip({ band }: { band: BandName | null }) {
  if (!band) return <span className="inline-flex rounded-full border border-dashed border-line-strong px-2 py-0.5 text-xs font-semibold text-ink-faint">no band</span>;
  return <span className={`inline-flex whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-bold ${bandTone[band].chip}`}>{band}</span>;
}
