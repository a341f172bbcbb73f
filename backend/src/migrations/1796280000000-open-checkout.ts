import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The Checkout page an organisation has open: the plan asked for, when, and Stripe's session id. While it is open
 * (24 hours, or until the subscription is applied or the session expires) the organisation's limits are the smaller
 * of its current plan's and that plan's, so it cannot fill past the plan it is about to pay for.
 */
export class OpenCheckout1796280000000 implements MigrationInterface {
  name = 'OpenCheckout1796280000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`organisation\` ADD \`checkoutPlan\` varchar(32) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`checkoutStartedAt\` datetime(3) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`checkoutSessionId\` varchar(255) NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`checkoutSessionId\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`checkoutStartedAt\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`checkoutPlan\``);
  }
}
