/** Step 3 of the import job: mark the import complete with its counts and queue the recompute of derived data, in one transaction. */
import type { DataSource } from 'typeorm';
import type { ImportCheck } from '../../import/index.js';
import { describeAlignment } from '../../import/prepare-file.js';
import type { AlignmentSummary } from '../../import/tall-alignment.js';
import { DataImport } from '../../entities/data-import.entity.js';
import { enqueueRecompute, withLease, type JobLease } from '../../jobs/job-queue.js';
import type { StoredRows } from './store-rows.js';

export type CompletionRecord = Pick<
  DataImport,
  'status' | 'progress' | 'message' | 'finishedAt' | 'storedPath' | 'firstTimestamp' | 'lastTimestamp' | 'notes'
> & { counts: object };

/** What a finished import records. */
export function completion(
  { summary, stored, skippedIdentical, conflicting, conflicts }: StoredRows,
  check: ImportCheck,
  now = new Date(),
  alignment: AlignmentSummary | null = null,
): CompletionRecord {
  return {
    status: 'complete',
    progress: 1,
    message: null,
    finishedAt: now,
    storedPath: null,
    counts: {
      rowsRead: summary.rowsRead,
      stored,
      skippedIdentical,
      conflicting,
      conflicts,
      rowsOk: summary.rowsOk,
      rowsByReason: summary.rowsByReason,
      rowsByMarker: summary.rowsByMarker,
      flowAssumedRows: summary.flowAssumedRows,
      ...(alignment ? { alignment } : {}),
    },
    firstTimestamp: summary.firstTimestampUtc !== null ? new Date(summary.firstTimestampUtc) : null,
    lastTimestamp: summary.lastTimestampUtc !== null ? new Date(summary.lastTimestampUtc) : null,
    notes: { assumptions: [...(alignment ? describeAlignment(alignment) : []), ...summary.assumptions], warnings: check.warnings },
  };
}

export async function completeAndQueueRecompute(
  ds: DataSource,
  job: JobLease,
  imp: Pick<DataImport, 'id' | 'organisationId' | 'unitId'>,
  rows: StoredRows,
  check: ImportCheck,
  alignment: AlignmentSummary | null = null,
): Promise<void> {
  await withLease(ds, job, async (em) => {
    await em.getRepository(DataImport).update({ id: imp.id }, completion(rows, check, new Date(), alignment));
    await enqueueRecompute(em, imp.organisationId, imp.unitId, 'import complete');
  });
}
