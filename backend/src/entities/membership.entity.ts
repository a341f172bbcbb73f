import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Organisation } from './organisation.entity.js';
import { User } from './user.entity.js';

import type { Role } from '@shared/permissions.js';

export { ROLES, type Role } from '@shared/permissions.js';

/** A user's role in one tenant, optionally limited to some client groups. */
@Entity('membership')
@Index(['organisationId', 'userId'], { unique: true })
export class Membership {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) userId: string;
  @Column({ type: 'varchar', length: 16 }) role: Role;
  /** null: sees every plant of the tenant; otherwise only plants in these client groups. */
  @Column({ type: 'json', nullable: true }) clientGroupIds: string[] | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
  @ManyToOne(() => User, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'userId' }) user?: User;
}
