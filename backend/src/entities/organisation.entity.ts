import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export type SubscriptionStatus = 'trialing' | 'active' | 'past_due' | 'canceled' | 'unpaid';

/** A tenant: an organisation with its own subscription. */
@Entity('organisation')
export class Organisation {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 160 }) name: string;
  @Column({ type: 'varchar', length: 16, default: 'utility' }) kind: 'utility' | 'consultancy';
  @Column({ type: 'varchar', length: 32, default: 'trial' }) plan: string;
  @Column({ type: 'varchar', length: 16, default: 'trialing' }) subscriptionStatus: SubscriptionStatus;
  @Column({ type: 'datetime', precision: 3, nullable: true }) trialEndsAt: Date | null;
  @Column({ type: 'varchar', length: 64, nullable: true }) stripeCustomerId: string | null;
  @Column({ type: 'varchar', length: 64, nullable: true }) stripeSubscriptionId: string | null;
  /** The lookup key of the subscribed Stripe price (plan and interval); null on the trial. */
  @Column({ type: 'varchar', length: 64, nullable: true }) priceLookupKey: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) currentPeriodEnd: Date | null;
  @Column({ type: 'boolean', default: false }) cancelAtPeriodEnd: boolean;
  /** When the subscription fell past due; read-only begins after the grace period. */
  @Column({ type: 'datetime', precision: 3, nullable: true }) pastDueSince: Date | null;
  /** When the subscription state written here was read from Stripe: an older read never overwrites a newer one. */
  @Column({ type: 'datetime', precision: 3, nullable: true }) billingStateAt: Date | null;
  /** When the trial-ending message went out (once per trial). */
  @Column({ type: 'datetime', precision: 3, nullable: true }) trialEndingMailAt: Date | null;
  /** The plan of the Checkout page last asked for, while it may still be paid (see services/billing/open-checkout.ts). */
  @Column({ type: 'varchar', length: 32, nullable: true }) checkoutPlan: string | null;
  @Column({ type: 'datetime', precision: 3, nullable: true }) checkoutStartedAt: Date | null;
  /** Stripe's id of that Checkout session: its expiry event clears the three. */
  @Column({ type: 'varchar', length: 255, nullable: true }) checkoutSessionId: string | null;
  /** The organisation's own historian status words, besides the defaults (shared/schemas/historian-status.ts). */
  @Column({ type: 'json', nullable: true }) historianStatusWords: string[] | null;
  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date;
}
