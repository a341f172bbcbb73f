import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';
import { Membership } from './membership.entity.js';

import type { UnitConditionKind } from '@shared/domain/portfolio/unit-conditions.js';

/**
 * The de-duplication record of one alert: a unit's condition as last told to one person. Open (clearedAt null)
 * from the mail that raised it until the condition clears; one row per person, unit and condition, reopened
 * when the condition comes back. The unique key is what makes two evaluations at once send one mail.
 */
@Entity('alert_state')
@Index(['membershipId', 'unitId', 'kind'], { unique: true })
@Index(['organisationId', 'unitId'])
export class AlertState {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'uuid' }) membershipId: string;
  @Column({ type: 'varchar', length: 32 }) kind: UnitConditionKind;
  @Column({ type: 'datetime', precision: 3 }) raisedAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) clearedAt: Date | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) lastSentAt: Date | null;

  @ManyToOne(() => Membership, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'membershipId' }) membership?: Membership;
  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
