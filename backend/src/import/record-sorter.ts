/**
 * Puts converted records of a file that is not in time order back into order with bounded memory:
 * chunks of records are sorted in memory and written as runs to one temporary file, then the runs
 * are merged (external merge sort). A file that fits in one chunk never touches the disk.
 */
import { mkdtemp, open, rm, type FileHandle } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { F, RECORD_FIELDS } from './row-conversion.js';

const RECORD_BYTES = RECORD_FIELDS * 8;
const READ_RECORDS = 2048;

export class RecordSorter {
  private chunk: Float64Array;
  private count = 0;
  private runs: { offset: number; count: number }[] = [];
  private dir?: string;
  private file?: FileHandle;
  private written = 0;

  constructor(
    private readonly tempDir = tmpdir(),
    private readonly chunkRecords = 65_536,
  ) {
    this.chunk = new Float64Array(chunkRecords * RECORD_FIELDS);
  }

  async add(record: Float64Array): Promise<void> {
    this.chunk.set(record, this.count * RECORD_FIELDS);
    this.count++;
    if (this.count === this.chunkRecords) await this.spill();
  }

  private sortedChunk(): Float64Array {
    const n = this.count;
    const order = new Uint32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    const c = this.chunk;
    order.sort((a, b) => c[a * RECORD_FIELDS + F.timestampUtc]! - c[b * RECORD_FIELDS + F.timestampUtc]!);
    const out = new Float64Array(n * RECORD_FIELDS);
    for (let i = 0; i < n; i++) out.set(c.subarray(order[i]! * RECORD_FIELDS, (order[i]! + 1) * RECORD_FIELDS), i * RECORD_FIELDS);
    return out;
  }

  private async spill(): Promise<void> {
    if (this.count === 0) return;
    if (!this.file) {
      this.dir = await mkdtemp(path.join(this.tempDir, 'cleancase-import-sort-'));
      this.file = await open(path.join(this.dir, 'runs.bin'), 'w+');
    }
    const sorted = this.sortedChunk();
    const bytes = Buffer.from(sorted.buffer, sorted.byteOffset, sorted.byteLength);
    await this.file.write(bytes, 0, bytes.length, this.written);
    this.runs.push({ offset: this.written, count: this.count });
    this.written += bytes.length;
    this.count = 0;
  }

  /** All records added, in ascending time. */
  async *sorted(): AsyncGenerator<Float64Array> {
    if (!this.file) {
      const sorted = this.sortedChunk();
      for (let i = 0; i < this.count; i++) yield sorted.slice(i * RECORD_FIELDS, (i + 1) * RECORD_FIELDS);
      return;
    }
    await this.spill();
    const file = this.file;
    const readers = this.runs.map((run) => ({ ...run, buf: new Float64Array(READ_RECORDS * RECORD_FIELDS), pos: 0, len: 0, next: 0 }));
    const refill = async (r: (typeof readers)[number]): Promise<void> => {
      const n = Math.min(READ_RECORDS, r.count - r.next);
      const bytes = Buffer.from(r.buf.buffer, 0, n * RECORD_BYTES);
      await file.read(bytes, 0, bytes.length, r.offset + r.next * RECORD_BYTES);
      r.next += n;
      r.pos = 0;
      r.len = n;
    };
    for (const r of readers) await refill(r);
    for (;;) {
      let best = -1;
      let bestT = Infinity;
      for (let k = 0; k < readers.length; k++) {
        const r = readers[k]!;
        if (r.pos < r.len && r.buf[r.pos * RECORD_FIELDS + F.timestampUtc]! < bestT) {
          best = k;
          bestT = r.buf[r.pos * RECORD_FIELDS + F.timestampUtc]!;
        }
      }
      if (best < 0) return;
      const r = readers[best]!;
      yield r.buf.slice(r.pos * RECORD_FIELDS, (r.pos + 1) * RECORD_FIELDS);
      r.pos++;
      if (r.pos === r.len && r.next < r.count) await refill(r);
    }
  }

  async dispose(): Promise<void> {
    await this.file?.close();
    if (this.dir) await rm(this.dir, { recursive: true, force: true });
    this.file = undefined;
    this.dir = undefined;
  }
}
