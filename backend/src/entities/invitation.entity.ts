import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from './membership.entity.js';
import { Organisation } from './organisation.entity.js';

/** An e-mailed invitation to join a tenant with a role; only the token's hash is stored. */
@Entity('invitation')
export class Invitation {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'varchar', length: 254 }) email: string;
  @Column({ type: 'varchar', length: 16 }) role: Role;
  @Column({ type: 'json', nullable: true }) clientGroupIds: string[] | null;
  @Index({ unique: true }) @Column({ type: 'char', length: 64 }) tokenHash: string;
  @Column({ type: 'uuid', nullable: true }) invitedByUserId: string | null;
  @Column({ type: 'datetime', precision: 3 }) expiresAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) acceptedAt: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
}
