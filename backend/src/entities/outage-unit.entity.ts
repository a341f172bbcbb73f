import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';
import { Outage } from './outage.entity.js';

/** A unit an outage takes off line. A deleted unit leaves its outages (an approved one keeps it in its snapshot). */
@Entity('outage_unit')
@Index(['unitId'])
export class OutageUnit {
  @PrimaryColumn({ type: 'uuid' }) outageId: string;
  @PrimaryColumn({ type: 'uuid' }) unitId: string;

  @ManyToOne(() => Outage, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'outageId' }) outage?: Outage;
  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
