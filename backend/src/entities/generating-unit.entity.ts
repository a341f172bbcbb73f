import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '@shared/schemas/unit-setup.js';
import { Plant } from './plant.entity.js';

/**
 * A generating unit with its condenser, turbine and economics setup. The setups are validated documents
 * (shared/schemas/unit-setup.ts); `setupVersion` rises with every change so derived data can tell it is stale.
 */
@Entity('generating_unit')
@Index(['plantId', 'name'], { unique: true })
export class GeneratingUnit {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) plantId: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'json', nullable: true }) condenser: CondenserSetup | null;
  @Column({ type: 'json', nullable: true }) turbine: TurbineSetup | null;
  @Column({ type: 'json', nullable: true }) economics: EconomicsSetup | null;
  /** The column mapping of the last import, offered for the next file. */
  @Column({ type: 'json', nullable: true }) savedMapping: unknown;
  @Column({ type: 'int', default: 1 }) setupVersion: number;
  /** Rises whenever the recompute replaces the daily figures or the analysis: a cached view keyed by it knows when it is stale. */
  @Column({ type: 'int', default: 1 }) dataVersion: number;
  /** Result of the last recompute: fouling trend per cleaning cycle, suspected air in-leakage, the cleaning outlook. */
  @Column({ type: 'json', nullable: true }) analysis: Record<string, unknown> | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Plant, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'plantId' }) plant?: Plant;
}
