import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { GeneratingUnit } from './generating-unit.entity.js';

import type { ImportStatus } from '@shared/schemas/imports.js';

export type { ImportStatus };

/** One historian file brought in: who, when, the mapping used, the outcome counts and the errors. */
@Entity('data_import')
@Index(['unitId', 'createdAt'])
export class DataImport {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'uuid', nullable: true }) uploadedByUserId: string | null;
  @Column({ type: 'varchar', length: 255 }) fileName: string;
  @Column({ type: 'bigint', transformer: { to: (v: number) => v, from: (v: string | number) => Number(v) } }) fileBytes: number;
  @Column({ type: 'varchar', length: 8, nullable: true }) fileKind: string | null;
  @Column({ type: 'varchar', length: 12 }) status: ImportStatus;
  @Column({ type: 'json' }) mapping: unknown;
  /** Outcome counts: rows read, stored, by validity reason, skipped identical, conflicting. */
  @Column({ type: 'json', nullable: true }) counts: Record<string, unknown> | null;
  /** File errors listed by row and column (capped), when the file was refused. */
  @Column({ type: 'json', nullable: true }) errors: unknown;
  @Column({ type: 'int', default: 0 }) errorCount: number;
  @Column({ type: 'json', nullable: true }) notes: { assumptions: string[]; warnings: string[] } | null;
  @Column({ type: 'double', default: 0 }) progress: number;
  @Column({ type: 'varchar', length: 500, nullable: true }) message: string | null;
  /** Where the upload waits on disk until the import job has read it. */
  @Column({ type: 'varchar', length: 500, nullable: true }) storedPath: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) firstTimestamp: Date | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) lastTimestamp: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) finishedAt: Date | null;

  @ManyToOne(() => GeneratingUnit, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
