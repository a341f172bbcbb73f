import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { CleaningCase } from './cleaning-case.entity.js';

/** A remark in a cleaning case's thread (author, analyst and approver discuss it there). */
@Entity('case_comment')
@Index(['caseId', 'createdAt'])
export class CaseCommentRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'uuid' }) caseId: string;
  @Column({ type: 'uuid', nullable: true }) authorId: string | null;
  @Column({ type: 'varchar', length: 4000 }) text: string;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => CleaningCase, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'caseId' }) cleaningCase?: CleaningCase;
}
