import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Accounts1796164373459 implements MigrationInterface {
  name = 'Accounts1796164373459';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`api_token\` (\`id\` uuid NOT NULL, \`userId\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`name\` varchar(80) NOT NULL, \`prefix\` varchar(16) NOT NULL, \`tokenHash\` char(64) NOT NULL, \`lastUsedAt\` datetime(3) NULL, \`revokedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_b8d5076cd3f3572829943b3f8a\` (\`tokenHash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`client_group\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`name\` varchar(120) NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_3c98debeeb6fb11bfb24f1bd0f\` (\`organisationId\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`invitation\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`email\` varchar(254) NOT NULL, \`role\` varchar(16) NOT NULL, \`clientGroupIds\` json NULL, \`tokenHash\` char(64) NOT NULL, \`invitedByUserId\` uuid NULL, \`expiresAt\` datetime(3) NOT NULL, \`acceptedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_676ef6471ce7176869d73365a4\` (\`tokenHash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`password_reset_token\` (\`id\` uuid NOT NULL, \`userId\` uuid NOT NULL, \`tokenHash\` char(64) NOT NULL, \`expiresAt\` datetime(3) NOT NULL, \`usedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_324e592c57094c9dcfa00ddf91\` (\`tokenHash\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`api_token\` ADD CONSTRAINT \`FK_cbfc4e2b85b78207afb0b2d7fbc\` FOREIGN KEY (\`userId\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`api_token\` ADD CONSTRAINT \`FK_06f66aa6db90756cca24a2389e2\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`client_group\` ADD CONSTRAINT \`FK_9ba2cf4fb8087e00a9728e762f9\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`invitation\` ADD CONSTRAINT \`FK_d5ea011d4c86a1798c03886e7b6\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`password_reset_token\` ADD CONSTRAINT \`FK_a4e53583f7a8ab7d01cded46a41\` FOREIGN KEY (\`userId\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`password_reset_token\` DROP FOREIGN KEY \`FK_a4e53583f7a8ab7d01cded46a41\``);
    await q.query(`ALTER TABLE \`invitation\` DROP FOREIGN KEY \`FK_d5ea011d4c86a1798c03886e7b6\``);
    await q.query(`ALTER TABLE \`client_group\` DROP FOREIGN KEY \`FK_9ba2cf4fb8087e00a9728e762f9\``);
    await q.query(`ALTER TABLE \`api_token\` DROP FOREIGN KEY \`FK_06f66aa6db90756cca24a2389e2\``);
    await q.query(`ALTER TABLE \`api_token\` DROP FOREIGN KEY \`FK_cbfc4e2b85b78207afb0b2d7fbc\``);
    await q.query(`DROP INDEX \`IDX_324e592c57094c9dcfa00ddf91\` ON \`password_reset_token\``);
    await q.query(`DROP TABLE \`password_reset_token\``);
    await q.query(`DROP INDEX \`IDX_676ef6471ce7176869d73365a4\` ON \`invitation\``);
    await q.query(`DROP TABLE \`invitation\``);
    await q.query(`DROP INDEX \`IDX_3c98debeeb6fb11bfb24f1bd0f\` ON \`client_group\``);
    await q.query(`DROP TABLE \`client_group\``);
    await q.query(`DROP INDEX \`IDX_b8d5076cd3f3572829943b3f8a\` ON \`api_token\``);
    await q.query(`DROP TABLE \`api_token\``);
  }
}
