import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Organisation } from './organisation.entity.js';
import { User } from './user.entity.js';

/** A personal API token for scripted calculation runs, bound to one tenant; only its hash is stored. */
@Entity('api_token')
export class ApiToken {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid' }) userId: string;
  @Column({ type: 'uuid' }) organisationId: string;
  @Column({ type: 'varchar', length: 80 }) name: string;
  /** First characters of the token, shown so people can tell their tokens apart. */
  @Column({ type: 'varchar', length: 16 }) prefix: string;
  @Index({ unique: true }) @Column({ type: 'char', length: 64 }) tokenHash: string;
  @Column({ type: 'datetime', precision: 3, nullable: true }) lastUsedAt: Date | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) revokedAt: Date | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;

  @ManyToOne(() => User, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'userId' }) user?: User;
  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' }) @JoinColumn({ name: 'organisationId' }) organisation?: Organisation;
}
