import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export const ROLES = ['admin', 'analyst', 'approver', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** A user's role in one tenant, optionally limited to some client groups. */
@Entity('membership')
@Index(['organisationId', 'userId'], { unique: true })
export class Membership {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'char', length: 36 }) organisationId: string;
  @Column({ type: 'char', length: 36 }) userId: string;
  @Column({ type: 'varchar', length: 16 }) role: Role;
  /** null: sees every plant of the tenant; otherwise only plants in these client groups. */
  @Column({ type: 'json', nullable: true }) clientGroupIds: string[] | null;
  @CreateDateColumn({ type: 'datetime', precision: 3 }) createdAt: Date;
}
