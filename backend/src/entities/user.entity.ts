import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export type UnitPreference = 'us' | 'si';

@Entity('user')
export class User {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 254, unique: true }) email: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'varchar', length: 255, nullable: true, select: false }) passwordHash: string | null;
  @Column({ type: 'varchar', length: 64, nullable: true, unique: true }) googleSub: string | null;
  @Column({ type: 'varchar', length: 2, default: 'us' }) unitPreference: UnitPreference;
  /** Sessions created before this instant are no longer valid (password change, sign-out everywhere). */
  @Column({ type: 'datetime', precision: 3, nullable: true }) sessionsValidFrom: Date | null;
  /**
   * When the person proved they receive mail at this address (an accepted invitation, a confirmed reset, Google
   * sign-in, an address confirmation, the demo seed); null until then. The local mailbox shows only mail after it.
   */
  @Column({ type: 'datetime', precision: 3, nullable: true }) emailProvenAt: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
}
