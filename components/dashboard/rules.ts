/**
 * When the dashboard calls a class rare. Common practice rather than a standard: a class is rare when it
 * holds under 5% of the final labels and under a third of an even share, 1/(3·C) for C classes.
 * Taking the smaller of the two keeps many-class projects (C = 20: even share 5%) from flagging half their classes.
 */
export const RARE_SHARE_FLOOR = 0.05;

export function rareThreshold(classCount: number): number {
  if (classCount <= 0) return 0;
  return Math.min(RARE_SHARE_FLOOR, 1 / (3 * classCount));
}

export function isRare(count: number, total: number, classCount: number): boolean {
  return total > 0 && count / total < rareThreshold(classCount);
}

/** Open-dispute age buckets, upper bounds in hours (the last one open-ended). */
export const DISPUTE_AGE_BUCKETS = [
  { key: "day", label: "under 1 day", upToHours: 24 },
  { key: "days3", label: "1–3 days", upToHours: 72 },
  { key: "week", label: "3–7 days", upToHours: 168 },
  { key: "month", label: "1–4 weeks", upToHours: 672 },
  { key: "older", label: "over 4 weeks", upToHours: null },
] as const;

export type DisputeAgeKey = (typeof DISPUTE_AGE_BUCKETS)[number]["key"];

export const PROGRESS_STATUSES = ["unlabelled", "in_progress", "agreed", "disputed", "ruled", "control"] as const;
export type ProgressStatus = (typeof PROGRESS_STATUSES)[number];
