/**
 * Step 6 of the recompute: writes each chunk of analysed samples back to `performance_sample` on one
 * connection (the statements are in repositories/sample-analysis.repository.ts), stamped with the setup version used.
 */
import type { DataSource } from 'typeorm';
import { closeAnalysisScratch, openAnalysisScratch, writeAnalyses, type AnalysedSample } from '../../repositories/sample-analysis.repository.js';

export interface WriteBackInput {
  setupVersion: number;
  chunks: AsyncIterable<AnalysedSample[]>;
  /** after each chunk, with the samples written so far */
  onChunk?: (written: number) => Promise<void>;
}

export async function writeBackAnalyses(ds: DataSource, { setupVersion, chunks, onChunk }: WriteBackInput): Promise<number> {
  const runner = ds.createQueryRunner();
  await runner.connect();
  let written = 0;
  try {
    await openAnalysisScratch(runner.manager);
    for await (const analysed of chunks) {
      if (analysed.length === 0) continue;
      await writeAnalyses(runner.manager, analysed, setupVersion);
      written += analysed.length;
      await onChunk?.(written);
    }
    await closeAnalysisScratch(runner.manager);
  } finally {
    await runner.release();
  }
  return written;
}
