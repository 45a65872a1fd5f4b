// Report-backed computations shared by the worker jobs and the owner's inline requests (small sets).
import { computeDoubts } from "./doubts";
import { computeProjectMap } from "./map";
import { runReport, setProgress } from "./reports";
import { computeTuning } from "./tuning";

const computations = { tuning: computeTuning, doubts: computeDoubts, map: computeProjectMap } as const;

/** Runs the report's computation and stores the result (or the failure) on the report row. */
export async function runReportComputation(reportId: number, kind: keyof typeof computations) {
  await runReport(reportId, async (report) => {
    let last = 0;
    const onProgress = async (p: number) => {
      if (p - last < 0.02 && p < 1) return;
      last = p;
      await setProgress(reportId, p);
    };
    const out = await computations[kind](report.projectId, { onProgress });
    if (!out) return { result: { empty: true, reason: "The project has no feature columns yet: import items first." }, knnVersion: report.knnVersion ?? 0 };
    return { result: out.report, knnVersion: out.knnVersion };
  });
}
