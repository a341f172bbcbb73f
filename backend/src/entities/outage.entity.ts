import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { ApprovedSnapshot, OptimiseResponse, OutageStatus } from '@shared/schemas/outages.js';
import { Organisation } from './organisation.entity.js';

/** The optimiser's latest answer, with the plan version it was computed for (stale once the plan changed). */
export type StoredProposal = OptimiseResponse & { planVersion: number };

/**
 * An outage: one or more units off line over a window of plant-local days, a budget in the organisation's currency
 * and candidate work items. Once approved, `approved` holds the frozen scope and nothing else changes.
 */
@Entity('outage')
@Index(['organisationId', 'status'])
export class Outage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  /** first and last day of the window, both inside it (plant-local) */
  @Column({ type: 'date' }) startDate: string;
  @Column({ type: 'date' }) endDate: string;
  @Column({ type: 'decimal', precision: 15, scale: 2 }) budget: string;
  /** the organisation's currency when the outage was created (ISO 4217) */
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ type: 'varchar', length: 16 }) status: OutageStatus;
  /** raised by every change of the window, budget, units or items: a proposal for an older version is stale */
  @Column({ type: 'int', default: 1 }) planVersion: number;
  /** raised by every write (optimistic concurrency) */
  @Column({ type: 'int', default: 1 }) version: number;
  @Column({ type: 'json', nullable: true }) proposal: StoredProposal | null;
  @Column({ type: 'json', nullable: true }) approved: ApprovedSnapshot | null;
  @Column({ type: 'uuid', nullable: true }) approvedById: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) approvedAt: Date | null;
  @Column({ type: 'uuid' }) createdById: string;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @Column({ type: 'datetime', precision: 3 }) updatedAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
}
