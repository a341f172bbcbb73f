import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Each organisation's subscription as last read from Stripe, and the Stripe events whose effect is committed. */
export class Subscriptions1796230000000 implements MigrationInterface {
  name = 'Subscriptions1796230000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`billing_webhook_event\` (\`id\` varchar(255) NOT NULL, \`type\` varchar(64) NOT NULL, \`organisationId\` uuid NULL, \`eventCreatedAt\` datetime(3) NOT NULL, \`processedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(`ALTER TABLE \`organisation\` ADD \`priceLookupKey\` varchar(64) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`currentPeriodEnd\` datetime(3) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`cancelAtPeriodEnd\` tinyint NOT NULL DEFAULT 0`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`pastDueSince\` datetime(3) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`billingStateAt\` datetime(3) NULL`);
    await q.query(`ALTER TABLE \`organisation\` ADD \`trialEndingMailAt\` datetime(3) NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`trialEndingMailAt\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`billingStateAt\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`pastDueSince\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`cancelAtPeriodEnd\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`currentPeriodEnd\``);
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`priceLookupKey\``);
    await q.query(`DROP TABLE \`billing_webhook_event\``);
  }
}
