import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';
import { Membership } from './membership.entity.js';

import type { UnitConditionKind } from '@shared/domain/portfolio/unit-conditions.js';

/**
 * A person's e-mail alert choices in one organisation. The row without a unit holds the person-wide choices
 * (the weekly digest, and conditions for every unit in their scope, units added later included); a row with a
 * unit holds that unit's own choices, which replace the person-wide conditions for it.
 */
@Entity('alert_subscription')
@Index(['membershipId', 'unitId'], { unique: true })
@Index(['organisationId'])
export class AlertSubscription {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) membershipId: string;
  @Column({ type: 'uuid' }) userId: string;
  /** null: the person-wide row */
  @Column({ type: 'uuid', nullable: true }) unitId: string | null;
  @Column({ type: 'json' }) kinds: UnitConditionKind[];
  /** days without data before "data stopped" is raised (1–60) */
  @Column({ type: 'int', default: 3 }) dataStoppedDays: number;
  /** person-wide row only */
  @Column({ type: 'boolean', default: false }) weeklyDigest: boolean;
  /** the ISO week (2026-W49) whose digest was last sent; person-wide row only */
  @Column({ type: 'varchar', length: 8, nullable: true }) digestWeek: string | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' }) updatedAt: Date;

  @ManyToOne(() => Membership, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'membershipId' }) membership?: Membership;
  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
