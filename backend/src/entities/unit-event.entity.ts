import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';

export const UNIT_EVENT_KINDS = ['cleaning', 'tube-plugging', 'air-leak-repair', 'outage', 'other'] as const;
export type UnitEventKind = (typeof UNIT_EVENT_KINDS)[number];

/** Something that happened to the unit, on its timeline (plant-local dates). */
@Entity('unit_event')
@Index(['unitId', 'startDate'])
export class UnitEvent {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'varchar', length: 24 }) kind: UnitEventKind;
  @Column({ type: 'date' }) startDate: string;
  @Column({ type: 'date', nullable: true }) endDate: string | null;
  @Column({ type: 'varchar', length: 64, nullable: true }) methodId: string | null;
  @Column({ type: 'decimal', precision: 14, scale: 2, nullable: true }) cost: string | null;
  @Column({ type: 'double', nullable: true }) cleanlinessBefore: number | null;
  @Column({ type: 'double', nullable: true }) cleanlinessAfter: number | null;
  @Column({ type: 'int', nullable: true }) pluggedTubesAfter: number | null;
  @Column({ type: 'varchar', length: 2000, nullable: true }) notes: string | null;
  @Column({ type: 'uuid', nullable: true }) createdByUserId: string | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
