import { formatDistance } from "./format";
import type { DeskClass, DeskNeighbour } from "./types";

/**
 * Vicinal's picture of a vote: the item at the centre, its k neighbours around it at their rank's bearing and at
 * a radius that grows with distance (the nearest inner, the farthest on the outer ring), each in its class colour.
 */
export function VicinityDial({ neighbours, classes, size = 200 }: { neighbours: DeskNeighbour[]; classes: DeskClass[]; size?: number }) {
  const colour = new Map(classes.map((c) => [c.id, c.colour]));
  const name = new Map(classes.map((c) => [c.id, c.name]));
  const c = size / 2;
  const rMin = size * 0.16;
  const rMax = size * 0.43;
  const dMax = Math.max(...neighbours.map((n) => n.distance), 1e-9);
  const dMin = Math.min(...neighbours.map((n) => n.distance), dMax);
  const span = dMax - dMin || 1;
  const k = Math.max(neighbours.length, 1);
  return (
    <svg width={size} height={size} viewBox={`0 0 ${size} ${size}`} role="img" aria-label={`The ${neighbours.length} nearest labelled items, nearest inside`}>
      {[rMin, (rMin + rMax) / 2, rMax].map((r) => (
        <circle key={r} cx={c} cy={c} r={r} fill="none" stroke="#d9d3c7" strokeDasharray={r === rMax ? "2 4" : undefined} />
      ))}
      {neighbours.map((n, i) => {
        const angle = (-90 + (360 * i) / k) * (Math.PI / 180);
        const r = rMin + ((n.distance - dMin) / span) * (rMax - rMin);
        const x = c + r * Math.cos(angle);
        const y = c + r * Math.sin(angle);
        return (
          <g key={n.itemId}>
            <line x1={c} y1={c} x2={x} y2={y} stroke={colour.get(n.classId) ?? "#6b7282"} strokeOpacity={0.35} strokeWidth={1.5} />
            <circle cx={x} cy={y} r={size * 0.055} fill={colour.get(n.classId) ?? "#6b7282"} stroke="#fffdf8" strokeWidth={2}>
              <title>{`#${i + 1} ${n.externalId}: ${name.get(n.classId) ?? "?"}, distance ${formatDistance(n.distance)}`}</title>
            </circle>
            <text x={x} y={y} dy="0.35em" textAnchor="middle" fontSize={size * 0.05} fontWeight={700} fill="#fffdf8">
              {i + 1}
            </text>
          </g>
        );
      })}
      <circle cx={c} cy={c} r={size * 0.045} fill="#1d2433" />
      <circle cx={c} cy={c} r={size * 0.075} fill="none" stroke="#d9a441" strokeWidth={2} />
    </svg>
  );
}
