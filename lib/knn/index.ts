// Pure k-NN engine. Pool ranking (worker threads + hnswlib-node) lives in ./pool and ./hnsw-index,
// imported directly by the worker so web bundles never load the native addon.
export * from "./types";
export { TopK } from "./top-k";
export { squaredEuclidean, manhattan, dot, distanceBetween, COSINE_ZERO } from "./distance";
export { ExactIndex, type SearchOptions } from "./exact-index";
export { vote, TIE_TOLERANCE } from "./vote";
export { suggest, type SuggestOptions } from "./suggest";
export { fitPreprocessor, transformTable, preprocessStateSchema, type PreprocessState, type TableInput } from "./preprocess";
export { leastConfident, margin, entropy, orderByScore, randomOrder, mulberry32, orderings, type Ordering } from "./scores";
export {
  tune, evaluate, reliability, leaveOneOutNeighbours, defaultKs, LOG_LOSS_EPSILON, logLossSmoothing,
  type LabelledSet, type TuningResult, type ReliabilityBin,
} from "./tuning";
export { findDoubts, type Doubt } from "./doubts";
export { computeMap, type ItemMap, type MapCell, type MapOptions } from "./map";
