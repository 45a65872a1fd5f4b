import type { TuningReport } from "@/lib/suggest/tuning";

export type ReportView<R> = {
  id: number;
  status: "pending" | "running" | "succeeded" | "failed" | "cancelled";
  progress: number;
  message: string | null;
  knnVersion: number | null;
  createdAt: string;
  finishedAt: string | null;
  result: R | { empty: true; reason: string } | null;
};

export type TuningPayload = {
  data: { report: ReportView<TuningReport> | null; version: number; voters: number; settings: { k: number; distance: string; weighting: string } };
};

export const distanceLook: Record<string, { colour: string; dash: string; label: string }> = {
  euclidean: { colour: "#1f5f5b", dash: "0", label: "Euclidean" },
  manhattan: { colour: "#c8922a", dash: "6 3", label: "Manhattan" },
  cosine: { colour: "#7b5ea7", dash: "2 3", label: "Cosine" },
};

export const pct = (v: number | null | undefined, digits = 1) => (v === null || v === undefined ? "–" : `${(100 * v).toFixed(digits)}%`);
