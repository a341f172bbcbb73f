import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Outage } from './outage.entity.js';

/** A named selection of an outage's items kept to compare side by side (at most three per outage). */
@Entity('outage_scope')
@Index(['outageId'])
export class OutageScope {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) outageId: string;
  @Column({ type: 'varchar', length: 80 }) name: string;
  @Column({ type: 'json' }) itemIds: string[];
  @Column({ type: 'uuid' }) createdById: string;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Outage, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'outageId' }) outage?: Outage;
}
