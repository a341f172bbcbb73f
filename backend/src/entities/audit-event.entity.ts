import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who changed what, per tenant. */
@Entity('audit_event')
@Index(['organisationId', 'createdAt'])
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'char', length: 36 }) organisationId: string;
  @Column({ type: 'char', length: 36, nullable: true }) userId: string | null;
  @Column({ type: 'varchar', length: 64 }) action: string;
  @Column({ type: 'varchar', length: 64 }) entityType: string;
  @Column({ type: 'varchar', length: 64, nullable: true }) entityId: string | null;
  @Column({ type: 'json', nullable: true }) details: Record<string, unknown> | null;
  @CreateDateColumn({ type: 'datetime', precision: 3 }) createdAt: Date;
}
