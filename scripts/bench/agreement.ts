/**
 * Benchmark of lib/agreement: 1 000 000 labels (5 annotators × 200 000 items, seeded, alpha ≈ 0.6), the full
 * report including percentile bootstrap intervals, on one core. Progress on stderr; one JSON line on stdout.
 * Baseline in the same run: a naive resample that recounts each drawn item's raw labels (alpha only).
 */
import { computeAgreement, createRandom } from "@/lib/agreement";
import type { AgreementInput } from "@/lib/agreement";

const ITEMS = 200_000;
const ANNOTATORS = 5;
const CLASSES = 5;
const PREVALENCE = [0.35, 0.25, 0.2, 0.12, 0.08];
const ACCURACY = [0.86, 0.82, 0.8, 0.77, 0.74];
const NAIVE_RESAMPLES = 3;

const log = (message: string) => process.stderr.write(`[bench:agreement] ${message}\n`);

function drawClass(random: () => number): number {
  let u = random();
  for (let c = 0; c < CLASSES - 1; c += 1) {
    if (u < PREVALENCE[c]) return c;
    u -= PREVALENCE[c];
  }
  return CLASSES - 1;
}

function buildInput(seed: number): AgreementInput {
  const random = createRandom(seed);
  const n = ITEMS * ANNOTATORS;
  const item = new Int32Array(n);
  const annotator = new Int32Array(n);
  const label = new Int32Array(n);
  const blind = new Uint8Array(n);
  const suggestionTop = new Int32Array(n);
  const tookSuggestion = new Uint8Array(n);
  const finalLabel = new Int32Array(ITEMS);
  const controlLabel = new Int32Array(ITEMS).fill(-1);
  const votes = new Int32Array(CLASSES);
  for (let i = 0; i < ITEMS; i += 1) {
    const truth = drawClass(random);
    if (random() < 0.02) controlLabel[i] = truth;
    const itemBlind = random() < 0.1 ? 1 : 0;
    votes.fill(0);
    for (let a = 0; a < ANNOTATORS; a += 1) {
      const r = i * ANNOTATORS + a;
      item[r] = i;
      annotator[r] = a;
      const top = random() < 0.75 ? truth : drawClass(random);
      suggestionTop[r] = top;
      blind[r] = itemBlind;
      const took = !itemBlind && random() < 0.3;
      label[r] = took ? top : random() < ACCURACY[a] ? truth : drawClass(random);
      tookSuggestion[r] = took && label[r] === top ? 1 : 0;
      votes[label[r]] += 1;
    }
    let best = 0;
    for (let c = 1; c < CLASSES; c += 1) if (votes[c] > votes[best]) best = c;
    finalLabel[i] = best;
  }
  return { itemCount: ITEMS, annotatorCount: ANNOTATORS, classCount: CLASSES, item, annotator, label, finalLabel, controlLabel, blind, suggestionTop, tookSuggestion };
}

/** Alpha of one resample recounted from each drawn item's raw labels: the cost the pattern sums avoid. */
function naiveResampleAlpha(input: AgreementInput, random: () => number): number {
  const counts = new Float64Array(CLASSES);
  const perItem = new Int32Array(CLASSES);
  let n = 0;
  let same = 0;
  for (let j = 0; j < ITEMS; j += 1) {
    const i = Math.floor(random() * ITEMS);
    perItem.fill(0);
    // buildInput stores item i's ratings at i·ANNOTATORS … i·ANNOTATORS + ANNOTATORS − 1.
    for (let r = i * ANNOTATORS; r < (i + 1) * ANNOTATORS; r += 1) perItem[input.label[r]] += 1;
    n += ANNOTATORS;
    for (let c = 0; c < CLASSES; c += 1) {
      counts[c] += perItem[c];
      same += (perItem[c] * (perItem[c] - 1)) / (ANNOTATORS - 1);
    }
  }
  let squares = 0;
  for (let c = 0; c < CLASSES; c += 1) squares += counts[c] * counts[c];
  return 1 - ((n - 1) * (n - same)) / (n * n - squares);
}

function main() {
  log("building 1 000 000 labels");
  const input = buildInput(2024);
  log("computing without bootstrap");
  let t = performance.now();
  const plain = computeAgreement(input, { resamples: 0 });
  const secondsWithoutBootstrap = (performance.now() - t) / 1000;
  log(`alpha ${plain.krippendorffAlpha.value?.toFixed(3)}, fleiss ${plain.fleissKappa.value?.toFixed(3)} in ${secondsWithoutBootstrap.toFixed(3)} s`);
  const resamples = 1000;
  log(`computing with ${resamples} bootstrap resamples`);
  t = performance.now();
  const full = computeAgreement(input, { resamples, seed: 7 });
  const seconds = (performance.now() - t) / 1000;
  log(`${full.reading} in ${seconds.toFixed(3)} s`);
  log(`naive baseline: ${NAIVE_RESAMPLES} resamples recounted from raw labels`);
  const random = createRandom(11);
  t = performance.now();
  for (let b = 0; b < NAIVE_RESAMPLES; b += 1) naiveResampleAlpha(input, random);
  const naiveSecondsPerResample = (performance.now() - t) / 1000 / NAIVE_RESAMPLES;
  const secondsPerResample = (seconds - secondsWithoutBootstrap) / resamples;
  process.stdout.write(
    `${JSON.stringify({
      labels: input.item.length,
      seconds: Number(seconds.toFixed(3)),
      secondsWithoutBootstrap: Number(secondsWithoutBootstrap.toFixed(3)),
      bootstrapResamples: resamples,
      alpha: full.krippendorffAlpha.value,
      alphaCi95: full.krippendorffAlpha.ci95,
      naiveSecondsPerResample: Number(naiveSecondsPerResample.toFixed(4)),
      secondsPerResample: Number(secondsPerResample.toFixed(5)),
      speedupPerResample: Number((naiveSecondsPerResample / secondsPerResample).toFixed(1)),
      targetSeconds: 2,
      withinTarget: seconds <= 2,
    })}\n`,
  );
}

main();
