import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from './user.entity.js';

/** A single-use, expiring link that proves a person receives mail at their account's address; only its hash is stored. */
@Entity('address_confirmation_token')
export class AddressConfirmationToken {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) userId: string;
  @Index({ unique: true }) @Column({ type: 'char', length: 64 }) tokenHash: string;
  @Column({ type: 'datetime', precision: 3 }) expiresAt: Date;
  @Column({ type: 'datetime', precision: 3, nullable: true }) usedAt: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'userId' }) user?: User;
}
