import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';

const num = { type: 'double' as const, nullable: true };

/**
 * One historian row in SI, with its validity reason and the engine's derived results. Written in bulk by
 * the import (plain SQL for speed; this entity describes the table).
 */
@Entity('performance_sample')
@Index(['unitId', 'timestampUtc'], { unique: true })
@Index(['importId'])
export class PerformanceSample {
  @PrimaryGeneratedColumn({ type: 'bigint' }) id: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'uuid' }) importId: string;
  @Column({ type: 'datetime', precision: 3 }) timestampUtc: Date;
  /** The five required readings are null only in a row the historian marked (validity `instrument-status`). */
  @Column(num) loadMw: number | null;
  @Column(num) backpressureKpa: number | null;
  @Column(num) cwInletC: number | null;
  @Column(num) cwOutletC: number | null;
  @Column(num) cwFlowM3s: number | null;
  @Column({ type: 'boolean', default: false }) flowAssumed: boolean;
  @Column(num) hotwellC: number | null;
  @Column(num) dissolvedOxygenPpb: number | null;
  @Column(num) airRemovalKgS: number | null;
  @Column(num) barometerKpa: number | null;
  @Column(num) cwDifferentialPressureKpa: number | null;
  @Column(num) condensateFlowKgS: number | null;
  /** 'ok' or the reason code the point is left out of the calculations. */
  @Column({ type: 'varchar', length: 32 }) validity: string;
  // Derived by the engine (null for rows left out):
  @Column(num) cleanliness: number | null;
  @Column(num) ttdK: number | null;
  @Column(num) dutyMw: number | null;
  @Column(num) expectedBackpressureKpa: number | null;
  @Column(num) excessBackpressureKpa: number | null;
  @Column(num) foulingKpa: number | null;
  @Column(num) cwInletKpa: number | null;
  @Column(num) cwFlowKpa: number | null;
  @Column(num) loadKpa: number | null;
  @Column(num) pluggingKpa: number | null;
  @Column(num) unexplainedKpa: number | null;
  @Column(num) heatRatePenaltyPct: number | null;
  @Column(num) foulingCostPerHour: number | null;
  @Column(num) unexplainedCostPerHour: number | null;
  @Column({ type: 'int', default: 0 }) setupVersion: number;

  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
