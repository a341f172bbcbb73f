import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A Stripe event whose effect is committed: stored in the same transaction as the effect, so a redelivery does nothing. */
@Entity('billing_webhook_event')
export class BillingWebhookEvent {
  @PrimaryColumn({ type: 'varchar', length: 255 }) id: string;
  @Column({ type: 'varchar', length: 64 }) type: string;
  @Column({ type: 'uuid', nullable: true }) organisationId: string | null;
  /** Stripe's `created` of the event. */
  @Column({ type: 'datetime', precision: 3 }) eventCreatedAt: Date;
  @Column({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) processedAt: Date;
}
