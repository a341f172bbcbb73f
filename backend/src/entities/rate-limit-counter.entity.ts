import { Column, Entity, PrimaryColumn } from 'typeorm';

export const RATE_LIMIT_TABLE = 'rate_limit_counter';

/**
 * One rate-limit counter (rate-limiter-flexible's MySQL store, which writes the columns in this order):
 * the limit's name and a hash of what it counts, the points used, and when the window ends (ms since epoch).
 */
@Entity(RATE_LIMIT_TABLE)
export class RateLimitCounter {
  @PrimaryColumn({ type: 'varchar', length: 128 }) key: string;
  @Column({ type: 'int', default: 0 }) points: number;
  @Column({ type: 'bigint', unsigned: true, nullable: true }) expire: string | null;
}
