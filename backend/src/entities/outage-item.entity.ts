import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { OutageItemKind } from '@shared/schemas/outages.js';
import { CleaningCase } from './cleaning-case.entity.js';
import { GeneratingUnit } from './generating-unit.entity.js';
import { Outage } from './outage.entity.js';

export type PricingMethod = 'entered' | 'cleanliness' | 'case';

/**
 * A candidate piece of work for an outage. Its benefit is priced when it is added or changed and kept with the
 * sentence saying how (`pricedBenefit`, `pricingText`), so the figures the optimiser used can be read back.
 */
@Entity('outage_item')
@Index(['outageId'])
@Index(['unitId'])
export class OutageItem {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) outageId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'varchar', length: 32 }) kind: OutageItemKind;
  @Column({ type: 'varchar', length: 120 }) title: string;
  @Column({ type: 'decimal', precision: 15, scale: 2 }) cost: string;
  @Column({ type: 'int' }) durationDays: number;
  @Column({ type: 'varchar', length: 40 }) lane: string;
  /** a benefit typed as money (null when priced from a cleanliness or a case) */
  @Column({ type: 'decimal', precision: 15, scale: 2, nullable: true }) benefitMoney: string | null;
  @Column({ type: 'double', nullable: true }) cleanlinessRecovered: number | null;
  @Column({ type: 'int', nullable: true }) horizonDays: number | null;
  /** the approved case whose cleaning this is */
  @Column({ type: 'uuid', nullable: true }) caseId: string | null;
  @Column({ type: 'decimal', precision: 15, scale: 2 }) pricedBenefit: string;
  @Column({ type: 'varchar', length: 16 }) pricingMethod: PricingMethod;
  @Column({ type: 'varchar', length: 1000 }) pricingText: string;
  /** ids of items of the same outage this one needs */
  @Column({ type: 'json' }) needs: string[];
  @Column({ type: 'varchar', length: 3, nullable: true }) forced: 'in' | 'out' | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @Column({ type: 'datetime', precision: 3 }) updatedAt: Date;

  @ManyToOne(() => Outage, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'outageId' }) outage?: Outage;
  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
  @ManyToOne(() => CleaningCase, { onDelete: 'SET NULL' }) @JoinColumn({ name: 'caseId' }) case?: CleaningCase;
}
