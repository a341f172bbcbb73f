import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import type { CaseStatus, InputSources } from '@shared/schemas/cases.js';
import { GeneratingUnit } from './generating-unit.entity.js';
import { Organisation } from './organisation.entity.js';

/**
 * A cleaning case: the business case for cleaning one unit's condenser. `inputs` is a `calc schedule` input and
 * `results` its output, kept as built; once submitted the case is a snapshot and never recomputed.
 */
@Entity('cleaning_case')
@Index(['organisationId', 'status'])
@Index(['unitId'])
export class CleaningCase {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) unitId: string;
  @Column({ type: 'varchar', length: 120 }) title: string;
  @Column({ type: 'varchar', length: 16 }) status: CaseStatus;
  @Column({ type: 'uuid' }) authorId: string;
  @Column({ type: 'json' }) inputs: CalcScheduleInput;
  @Column({ type: 'json' }) inputSources: InputSources;
  @Column({ type: 'json' }) results: CalcScheduleOutput;
  @Column({ type: 'varchar', length: 32 }) engineVersion: string;
  /** the unit's currency when the case was built (ISO 4217): part of the snapshot */
  @Column({ type: 'char', length: 3 }) currency: string;
  /** the unit's last day of data when the case was built (null: none) */
  @Column({ type: 'date', nullable: true }) lastDataDay: string | null;
  @Column({ type: 'int' }) setupVersion: number;
  @Column({ type: 'uuid', nullable: true }) copiedFromId: string | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
  @Column({ type: 'datetime', precision: 3 }) updatedAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) submittedAt: Date | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) decidedAt: Date | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) archivedAt: Date | null;
  @Column({ type: 'uuid', nullable: true }) decidedById: string | null;
  @Column({ type: 'varchar', length: 2000, nullable: true }) returnReason: string | null;
  /** who changed the title or inputs last, and everyone who changed them since the last decision: none of them decides */
  @Column({ type: 'uuid', nullable: true }) lastEditedById: string | null;
  @Column({ type: 'json', nullable: true }) editorIdsSinceDecision: string[] | null;
  @Column({ type: 'uuid', nullable: true }) submittedById: string | null;
  /** the unit's and plant's names when the case was last submitted: part of the snapshot */
  @Column({ type: 'varchar', length: 120, nullable: true }) unitNameAtSubmit: string | null;
  @Column({ type: 'varchar', length: 120, nullable: true }) plantNameAtSubmit: string | null;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
  /** A unit with cases other than drafts is never deleted (plant.service.ts says why); drafts are deleted first. */
  @ManyToOne(() => GeneratingUnit, { onDelete: 'RESTRICT' }) @JoinColumn({ name: 'unitId' }) unit?: GeneratingUnit;
}
