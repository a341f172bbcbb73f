import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Organisation } from './organisation.entity.js';

/** A consultancy's client (or any grouping of plants); memberships may be limited to some groups. */
@Entity('client_group')
@Index(['organisationId', 'name'], { unique: true })
export class ClientGroup {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
}
