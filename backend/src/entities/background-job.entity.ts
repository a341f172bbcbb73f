import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

import type { JobKind, JobStatus } from '@shared/schemas/jobs.js';

export type { JobKind, JobStatus };

/** Work done outside the request: claimed by any worker with SELECT … FOR UPDATE SKIP LOCKED. */
@Entity('background_job')
@Index(['status', 'createdAt'])
export class BackgroundJob {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'varchar', length: 16 }) kind: JobKind;
  @Column({ type: 'varchar', length: 12 }) status: JobStatus;
  @Column({ type: 'json', nullable: true }) payload: Record<string, unknown> | null;
  @Column({ type: 'double', default: 0 }) progress: number;
  @Column({ type: 'varchar', length: 500, nullable: true }) message: string | null;
  @Column({ type: 'varchar', length: 80, nullable: true }) lockedBy: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) lockedAt: Date | null;
  @Column({ type: 'int', default: 0 }) attempts: number;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) finishedAt: Date | null;
}
