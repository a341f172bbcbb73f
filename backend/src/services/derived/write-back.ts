/**
 * Step 6 of the recompute: writes each chunk of analysed samples back to `performance_sample` on one
 * connection (the statements are in repositories/sample-analysis.repository.ts), stamped with the setup version used.
 * While the database writes one chunk, the next is read and analysed (the two run on different cores).
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
  /** the chunk the database is writing now; its failure surfaces when it is awaited */
  let inFlight: Promise<void> = Promise.resolve();
  try {
    await openAnalysisScratch(runner.manager);
    try {
      for await (const analysed of chunks) {
        await inFlight;
        if (analysed.length === 0) continue;
        inFlight = writeAnalyses(runner.manager, analysed, setupVersion).then(async () => {
          written += analysed.length;
          await onChunk?.(written);
        });
        inFlight.catch(() => {});
      }
    } finally {
      await inFlight.catch(() => {});
    }
    await inFlight;
    await closeAnalysisScratch(runner.manager);
  } finally {
    await runner.release();
  }
  return written;
}
