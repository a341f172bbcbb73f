import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { CautionKey } from '@shared/schemas/cleaning-method.js';
import { Organisation } from './organisation.entity.js';

/** A tenant's cleaning-method library entry (shared/schemas/cleaning-method.ts). */
@Entity('cleaning_method')
@Index(['organisationId', 'methodKey'], { unique: true })
export class CleaningMethodRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'varchar', length: 60 }) methodKey: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'decimal', precision: 14, scale: 2 }) fixedCost: string;
  @Column({ type: 'decimal', precision: 10, scale: 2 }) costPerTube: string;
  @Column({ type: 'int' }) durationDays: number;
  @Column({ type: 'varchar', length: 8 }) unitDuringCleaning: 'outage' | 'derate' | 'online';
  @Column({ type: 'double' }) deratePct: number;
  @Column({ type: 'double' }) recoveredCleanliness: number;
  @Column({ type: 'double' }) foulingRateMultiplier: number;
  @Column({ type: 'json' }) cautions: CautionKey[];
  @Column({ type: 'boolean' }) typical: boolean;
  @Column({ type: 'varchar', length: 2000, nullable: true }) note: string | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
}
