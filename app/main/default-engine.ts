// The real analysis services: sharp decoding, the core pipeline, the batch engine and the demo writer.
import type { AnalysisEngine } from './engine';
import { ApiFailure } from './result';

const missing = (what: string) => async (): Promise<never> => {
  throw new ApiFailure('internal', `${what} is not available in this build yet`);
};

/** The engine backed by app/decode, core/pipeline and app/batch. */
export function createDefaultEngine(): AnalysisEngine {
  return {
    loadForView: missing('stack analysis'),
    readSlice: missing('slice reading'),
    runBatch: missing('the batch engine'),
    writeDemoDataSet: missing('the demo data writer'),
  };
}
