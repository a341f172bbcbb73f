import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { ClientGroup } from './client-group.entity.js';
import { Organisation } from './organisation.entity.js';

/** A power plant; days are counted in its own IANA time zone. */
@Entity('plant')
@Index(['organisationId', 'name'], { unique: true })
export class Plant {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  /** null: in no client group (visible only to members without a client-group limit). */
  @Column({ type: 'uuid', nullable: true }) clientGroupId: string | null;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'varchar', length: 64 }) timeZone: string;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
  @ManyToOne(() => ClientGroup, { onDelete: 'SET NULL' }) @JoinColumn({ name: 'clientGroupId' }) clientGroup?: ClientGroup;
}
