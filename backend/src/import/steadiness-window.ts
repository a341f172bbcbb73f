/**
 * Sliding ±window over records in ascending time order: for each record, the lowest and highest
 * load within the window (inclusive), found with two monotonic queues so the cost per record does
 * not grow with the sampling rate. A record is released once a later record lies beyond its window
 * (or at the end), so memory holds about one window of records. A record the historian marked (F.marker)
 * is released in its place but is no neighbour of the others: its load is not a reading to judge them by.
 */
import { F } from './row-conversion.js';

export type WindowEmit = (record: Float64Array, minLoad: number, minLoadTime: number, maxLoad: number, maxLoadTime: number) => void;

export class SteadinessWindow {
  private readonly records: Float64Array[] = [];
  private base = 0; // index of records[0] in the stream
  private center = 0; // stream index of the next record to release
  private readonly minQ: number[] = [];
  private readonly maxQ: number[] = [];
  private minHead = 0;
  private maxHead = 0;
  private lastTime = -Infinity;

  constructor(
    private readonly windowMs: number,
    private readonly emit: WindowEmit,
  ) {}

  /** The record at a stream index still held in the window (callers only ask for those). */
  private at(streamIndex: number): Float64Array {
    return this.records[streamIndex - this.base]!;
  }

  push(record: Float64Array): void {
    const t = record[F.timestampUtc]!;
    if (!(t > this.lastTime)) throw new RangeError('records must arrive in strictly ascending time order');
    this.lastTime = t;
    while (this.center < this.base + this.records.length && t > this.at(this.center)[F.timestampUtc]! + this.windowMs) this.release();
    const idx = this.base + this.records.length;
    this.records.push(record);
    const load = record[F.loadMw]!;
    if (record[F.marker]! > 0 || Number.isNaN(load)) return;
    while (this.minQ.length > this.minHead && this.at(this.minQ[this.minQ.length - 1]!)[F.loadMw]! >= load) this.minQ.pop();
    this.minQ.push(idx);
    while (this.maxQ.length > this.maxHead && this.at(this.maxQ[this.maxQ.length - 1]!)[F.loadMw]! <= load) this.maxQ.pop();
    this.maxQ.push(idx);
  }

  /** Releases every record still held. */
  flush(): void {
    while (this.center < this.base + this.records.length) this.release();
  }

  private release(): void {
    const rec = this.at(this.center);
    if (rec[F.marker]! > 0 || Number.isNaN(rec[F.loadMw]!)) {
      this.emit(rec, Number.NaN, Number.NaN, Number.NaN, Number.NaN);
      this.center++;
      this.compact();
      return;
    }
    const from = rec[F.timestampUtc]! - this.windowMs;
    while (this.at(this.minQ[this.minHead]!)[F.timestampUtc]! < from) this.minHead++;
    while (this.at(this.maxQ[this.maxHead]!)[F.timestampUtc]! < from) this.maxHead++;
    const lo = this.at(this.minQ[this.minHead]!);
    const hi = this.at(this.maxQ[this.maxHead]!);
    this.emit(rec, lo[F.loadMw]!, lo[F.timestampUtc]!, hi[F.loadMw]!, hi[F.timestampUtc]!);
    this.center++;
    this.compact();
  }

  /**
   * Drops records no longer needed: the queues hold every record that can still be a window's
   * minimum or maximum, so nothing older than their heads and the next record to release is read again.
   */
  private compact(): void {
    const keepFrom = Math.min(this.center, this.minQ[this.minHead] ?? this.center, this.maxQ[this.maxHead] ?? this.center);
    const drop = keepFrom - this.base;
    if (drop >= 4096 || (drop > 0 && drop === this.records.length)) {
      this.records.splice(0, drop);
      this.base = keepFrom;
    }
    if (this.minHead >= 4096) {
      this.minQ.splice(0, this.minHead);
      this.minHead = 0;
    }
    if (this.maxHead >= 4096) {
      this.maxQ.splice(0, this.maxHead);
      this.maxHead = 0;
    }
  }
}
