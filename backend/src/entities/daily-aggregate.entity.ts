import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';

const num = { type: 'double' as const, nullable: true };

/** One plant-local day of a unit: medians and means of the valid points, costs summed over the day. */
@Entity('daily_aggregate')
export class DailyAggregate {
  @PrimaryColumn({ type: 'uuid' }) unitId: string;
  @PrimaryColumn({ type: 'date' }) day: string;
  @Column({ type: 'int' }) pointsUsed: number;
  @Column({ type: 'int' }) pointsDropped: number;
  @Column({ type: 'json', nullable: true }) droppedByReason: Record<string, number> | null;
  @Column(num) medianCleanliness: number | null;
  @Column(num) medianTtdK: number | null;
  @Column(num) meanBackpressureKpa: number | null;
  @Column(num) meanExpectedBackpressureKpa: number | null;
  @Column(num) meanExcessBackpressureKpa: number | null;
  @Column(num) meanCwInletC: number | null;
  @Column(num) meanLoadMw: number | null;
  @Column(num) meanHeatRatePenaltyPct: number | null;
  @Column(num) foulingKpa: number | null;
  @Column(num) cwInletKpa: number | null;
  @Column(num) cwFlowKpa: number | null;
  @Column(num) loadKpa: number | null;
  @Column(num) pluggingKpa: number | null;
  @Column(num) unexplainedKpa: number | null;
  /** Fitted fouling-trend cleanliness for the day (null where no trend could be fitted). */
  @Column(num) trendCleanliness: number | null;
  @Column(num) meanSubcoolingK: number | null;
  @Column(num) meanDissolvedOxygenPpb: number | null;
  @Column(num) meanAirRemovalKgS: number | null;
  @Column({ type: 'boolean', default: false }) airLeakSuspected: boolean;
  /** CW-side duty and the heat-balance duty at the day's mean load, for their reconciliation. */
  @Column(num) meanDutyMw: number | null;
  @Column(num) heatBalanceDutyMw: number | null;
  /** Sensors whose readings did not change all day (six or more points). */
  @Column({ type: 'json', nullable: true }) stuckSensors: string[] | null;
  /** Money over the day's valid hours (each valid point stands for its share of the day). */
  @Column(num) foulingCost: number | null;
  @Column(num) unexplainedCost: number | null;

  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
