import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The session store table, in the layout express-mysql-session expects (its createDatabaseTable is off). */
export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE sessions (
      session_id varchar(128) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL PRIMARY KEY,
      expires int(11) unsigned NOT NULL,
      data mediumtext CHARACTER SET utf8mb4 COLLATE utf8mb4_bin
    ) ENGINE=InnoDB`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE sessions');
  }
}
