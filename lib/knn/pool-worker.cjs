// Worker entry: a worker thread does not inherit tsx's loader hooks and plain Node cannot load
// .ts, so register tsx's CommonJS hook (the project's .ts files load as CommonJS) and require
// the TypeScript worker.
require("tsx/cjs/api").register();
require("./pool-worker.ts");
