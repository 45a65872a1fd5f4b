import { formatCoefficient, type Interval } from "@/lib/agreement";
import { axisStart, bandStripes, intervalPhrase } from "./band-stripes";

export type IntervalRow = { key: string; label: string; value: number | null; ci95: Interval | null };

const W = 760;
const LABEL = 190;
const RIGHT = 16;
const TOP = 30;
const ROW = 34;

/**
 * Point estimates with their bootstrap 95% intervals as whiskers, over the Landis & Koch bands.
 * The numbers are repeated in the table beside it; the picture is aria-hidden-free but summarised.
 */
export function IntervalChart({ rows, title }: { rows: IntervalRow[]; title: string }) {
  const min = axisStart(rows, -0.2);
  const x = (v: number) => LABEL + ((Math.max(min, Math.min(1, v)) - min) / (1 - min)) * (W - LABEL - RIGHT);
  const height = TOP + rows.length * ROW + 22;
  const ticks = [min, ...[0, 0.2, 0.4, 0.6, 0.8, 1].filter((t) => t > min)];
  const summary = rows
    .map((r) => `${r.label}: ${r.value === null ? "undefined" : formatCoefficient(r.value)}${intervalPhrase(r.ci95)}`)
    .join("; ");
  return (
    <figure className="overflow-x-auto">
      <svg viewBox={`0 0 ${W} ${height}`} className="w-full min-w-[560px]" role="img" aria-label={`${title}. ${summary}`}>
        {bandStripes
          .filter((s) => s.to > min)
          .map((s) => (
            <g key={s.name}>
              <rect x={x(Math.max(s.from, min))} y={TOP - 6} width={x(s.to) - x(Math.max(s.from, min))} height={rows.length * ROW + 6} fill={s.fill} />
              <text x={(x(Math.max(s.from, min)) + x(s.to)) / 2} y={TOP - 12} textAnchor="middle" className="fill-ink-faint" fontSize="10.5" fontWeight="600">
                {s.name}
              </text>
            </g>
          ))}
        {ticks.map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={TOP - 6} y2={TOP + rows.length * ROW} stroke="#d9d3c7" strokeWidth="1" />
            <text x={x(t)} y={TOP + rows.length * ROW + 15} textAnchor="middle" fontSize="11" className="fill-ink-soft">
              {formatCoefficient(t)}
            </text>
          </g>
        ))}
        {rows.map((r, i) => {
          const cy = TOP + i * ROW + ROW / 2;
          return (
            <g key={r.key}>
              <text x={LABEL - 12} y={cy + 4} textAnchor="end" fontSize="12.5" fontWeight="600" className="fill-ink">
                {r.label.length > 26 ? `${r.label.slice(0, 25)}…` : r.label}
              </text>
              {r.value === null ? (
                <text x={x(0) + 6} y={cy + 4} fontSize="11.5" fontStyle="italic" className="fill-ink-faint">
                  cannot be computed yet
                </text>
              ) : (
                <>
                  {r.ci95 ? (
                    <g stroke="#17494a" strokeWidth="2.5" strokeLinecap="round">
                      <line x1={x(r.ci95.lower)} x2={x(r.ci95.upper)} y1={cy} y2={cy} />
                      <line x1={x(r.ci95.lower)} x2={x(r.ci95.lower)} y1={cy - 6} y2={cy + 6} />
                      <line x1={x(r.ci95.upper)} x2={x(r.ci95.upper)} y1={cy - 6} y2={cy + 6} />
                    </g>
                  ) : (
                    <line x1={x(r.value) - 18} x2={x(r.value) + 18} y1={cy} y2={cy} stroke="#b4442f" strokeWidth="1.5" strokeDasharray="2 3" />
                  )}
                  <rect x={x(r.value) - 5.5} y={cy - 5.5} width="11" height="11" transform={`rotate(45 ${x(r.value)} ${cy})`} fill="#fffdf8" stroke="#17494a" strokeWidth="2.5" />
                </>
              )}
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 text-xs text-ink-faint">
        Diamond: the estimate. Whiskers: its bootstrap 95% interval. A dashed red stroke marks a figure without an interval: do not read it alone.
      </figcaption>
    </figure>
  );
}
