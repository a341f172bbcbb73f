import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * Mail waiting to go out. Requests only add a row and answer; a loop in every app process delivers it
 * afterwards, so a slow or hung SMTP server never delays an answer, and the answer's timing does not tell
 * whether an account exists. A delivered row is deleted (its text may hold a single-use link).
 */
@Entity('mail_outbox')
@Index(['failedAt', 'availableAt'])
export class MailOutbox {
  @PrimaryGeneratedColumn('uuid') id: string;
  /** 'message': subject and body as written; 'password-reset': composed at delivery (the account may not exist). */
  @Column({ type: 'varchar', length: 32 }) kind: string;
  @Column({ type: 'varchar', length: 254 }) recipient: string;
  @Column({ type: 'varchar', length: 300, default: '' }) subject: string;
  @Column({ type: 'text', nullable: true }) body: string | null;
  @Column({ type: 'datetime', precision: 3 }) availableAt: Date;
  @Column({ type: 'int', default: 0 }) attempts: number;
  @Column({ type: 'varchar', length: 100, nullable: true }) claimedBy: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) claimedAt: Date | null;
  @Column({ type: 'varchar', length: 500, nullable: true }) lastError: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) failedAt: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
}
