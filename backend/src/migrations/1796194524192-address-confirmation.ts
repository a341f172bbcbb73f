import type { MigrationInterface, QueryRunner } from 'typeorm';

export class AddressConfirmation1796194524192 implements MigrationInterface {
  name = 'AddressConfirmation1796194524192';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`address_confirmation_token\` (\`id\` uuid NOT NULL, \`userId\` uuid NOT NULL, \`tokenHash\` char(64) NOT NULL, \`expiresAt\` datetime(3) NOT NULL, \`usedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_361037cd98809a2e690021974e\` (\`tokenHash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(`ALTER TABLE \`user\` ADD \`emailProvenAt\` datetime(3) NULL`);
    await q.query(
      `ALTER TABLE \`address_confirmation_token\` ADD CONSTRAINT \`FK_6b54fa00ab8b38c0c1087f781b2\` FOREIGN KEY (\`userId\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`address_confirmation_token\` DROP FOREIGN KEY \`FK_6b54fa00ab8b38c0c1087f781b2\``);
    await q.query(`ALTER TABLE \`user\` DROP COLUMN \`emailProvenAt\``);
    await q.query(`DROP INDEX \`IDX_361037cd98809a2e690021974e\` ON \`address_confirmation_token\``);
    await q.query(`DROP TABLE \`address_confirmation_token\``);
  }
}
