import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * A message the local SMTP sink received (local runs only, never with SMTP_URL). Kept in MariaDB so every
 * app process shows the same mail; one row per envelope recipient, read only by that recipient.
 */
@Entity('sink_message')
@Index(['recipient', 'receivedAt'])
export class SinkMessage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 254 }) recipient: string;
  @Column({ type: 'varchar', length: 300 }) sender: string;
  @Column({ type: 'varchar', length: 300 }) subject: string;
  @Column({ type: 'mediumtext' }) body: string;
  @Column({ type: 'datetime', precision: 3 }) receivedAt: Date;
}
