import type { MigrationInterface, QueryRunner } from 'typeorm';

export class UnitsAndData1796165772820 implements MigrationInterface {
  name = 'UnitsAndData1796165772820';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`background_job\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`kind\` varchar(16) NOT NULL, \`status\` varchar(12) NOT NULL, \`payload\` json NULL, \`progress\` double NOT NULL DEFAULT '0', \`message\` varchar(500) NULL, \`lockedBy\` varchar(80) NULL, \`lockedAt\` datetime(3) NULL, \`attempts\` int NOT NULL DEFAULT '0', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`finishedAt\` datetime(3) NULL, INDEX \`IDX_df19134678c388fed8956f5eb9\` (\`status\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`cleaning_method\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`methodKey\` varchar(60) NOT NULL, \`name\` varchar(120) NOT NULL, \`fixedCost\` decimal(14,2) NOT NULL, \`costPerTube\` decimal(10,2) NOT NULL, \`durationDays\` int NOT NULL, \`unitDuringCleaning\` varchar(8) NOT NULL, \`deratePct\` double NOT NULL, \`recoveredCleanliness\` double NOT NULL, \`foulingRateMultiplier\` double NOT NULL, \`cautions\` json NOT NULL, \`typical\` tinyint NOT NULL, \`note\` varchar(2000) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_c3cfdf626f48e86793b947c445\` (\`organisationId\`, \`methodKey\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`plant\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`clientGroupId\` uuid NULL, \`name\` varchar(120) NOT NULL, \`timeZone\` varchar(64) NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_881eef48588c106579de84c71e\` (\`organisationId\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`generating_unit\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`plantId\` uuid NOT NULL, \`name\` varchar(120) NOT NULL, \`condenser\` json NULL, \`turbine\` json NULL, \`economics\` json NULL, \`savedMapping\` json NULL, \`setupVersion\` int NOT NULL DEFAULT '1', \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_0a4f4fc3d3f2a10ab00440f3eb\` (\`plantId\`, \`name\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`daily_aggregate\` (\`unitId\` uuid NOT NULL, \`day\` date NOT NULL, \`pointsUsed\` int NOT NULL, \`pointsDropped\` int NOT NULL, \`droppedByReason\` json NULL, \`medianCleanliness\` double NULL, \`medianTtdK\` double NULL, \`meanBackpressureKpa\` double NULL, \`meanExpectedBackpressureKpa\` double NULL, \`meanExcessBackpressureKpa\` double NULL, \`meanCwInletC\` double NULL, \`meanLoadMw\` double NULL, \`meanHeatRatePenaltyPct\` double NULL, \`foulingKpa\` double NULL, \`cwInletKpa\` double NULL, \`cwFlowKpa\` double NULL, \`loadKpa\` double NULL, \`pluggingKpa\` double NULL, \`unexplainedKpa\` double NULL, \`foulingCost\` double NULL, \`unexplainedCost\` double NULL, PRIMARY KEY (\`unitId\`, \`day\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`data_import\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`uploadedByUserId\` uuid NULL, \`fileName\` varchar(255) NOT NULL, \`fileBytes\` bigint NOT NULL, \`fileKind\` varchar(8) NULL, \`status\` varchar(12) NOT NULL, \`mapping\` json NOT NULL, \`counts\` json NULL, \`errors\` json NULL, \`errorCount\` int NOT NULL DEFAULT '0', \`notes\` json NULL, \`progress\` double NOT NULL DEFAULT '0', \`message\` varchar(500) NULL, \`storedPath\` varchar(500) NULL, \`firstTimestamp\` datetime(3) NULL, \`lastTimestamp\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`finishedAt\` datetime(3) NULL, INDEX \`IDX_cced27b64dbe0e0c881b6948b9\` (\`unitId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`performance_sample\` (\`id\` bigint NOT NULL AUTO_INCREMENT, \`unitId\` uuid NOT NULL, \`importId\` uuid NOT NULL, \`timestampUtc\` datetime(3) NOT NULL, \`loadMw\` double NOT NULL, \`backpressureKpa\` double NOT NULL, \`cwInletC\` double NOT NULL, \`cwOutletC\` double NOT NULL, \`cwFlowM3s\` double NOT NULL, \`flowAssumed\` tinyint NOT NULL DEFAULT 0, \`hotwellC\` double NULL, \`dissolvedOxygenPpb\` double NULL, \`airRemovalKgS\` double NULL, \`barometerKpa\` double NULL, \`cwDifferentialPressureKpa\` double NULL, \`condensateFlowKgS\` double NULL, \`validity\` varchar(32) NOT NULL, \`cleanliness\` double NULL, \`ttdK\` double NULL, \`dutyMw\` double NULL, \`expectedBackpressureKpa\` double NULL, \`excessBackpressureKpa\` double NULL, \`foulingKpa\` double NULL, \`cwInletKpa\` double NULL, \`cwFlowKpa\` double NULL, \`loadKpa\` double NULL, \`pluggingKpa\` double NULL, \`unexplainedKpa\` double NULL, \`heatRatePenaltyPct\` double NULL, \`foulingCostPerHour\` double NULL, \`unexplainedCostPerHour\` double NULL, \`setupVersion\` int NOT NULL DEFAULT '0', INDEX \`IDX_1a958db7adedba0ee378147aac\` (\`importId\`), UNIQUE INDEX \`IDX_d1148df7562438e4a6b7b5881c\` (\`unitId\`, \`timestampUtc\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`unit_event\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`kind\` varchar(24) NOT NULL, \`startDate\` date NOT NULL, \`endDate\` date NULL, \`methodId\` varchar(64) NULL, \`cost\` decimal(14,2) NULL, \`cleanlinessBefore\` double NULL, \`cleanlinessAfter\` double NULL, \`pluggedTubesAfter\` int NULL, \`notes\` varchar(2000) NULL, \`createdByUserId\` uuid NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_e560d75e6d044050f5ccc4888e\` (\`unitId\`, \`startDate\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`cleaning_method\` ADD CONSTRAINT \`FK_f9c84ddf1ae04d66087b7446293\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`plant\` ADD CONSTRAINT \`FK_2d1b27c8fc97767f47a8e2ebf07\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`plant\` ADD CONSTRAINT \`FK_df448105b774d90ab97b801f4d5\` FOREIGN KEY (\`clientGroupId\`) REFERENCES \`client_group\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`generating_unit\` ADD CONSTRAINT \`FK_ee7b5d1a4e05343b0f676c5432d\` FOREIGN KEY (\`plantId\`) REFERENCES \`plant\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`daily_aggregate\` ADD CONSTRAINT \`FK_d9c7107b9edad7e5777fd59aba4\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`data_import\` ADD CONSTRAINT \`FK_fd78045ff53c16ce0154412836d\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`performance_sample\` ADD CONSTRAINT \`FK_015ef7525bc89570435d9757eab\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`unit_event\` ADD CONSTRAINT \`FK_41251c502dc95aa30d9782d1474\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`unit_event\` DROP FOREIGN KEY \`FK_41251c502dc95aa30d9782d1474\``);
    await q.query(`ALTER TABLE \`performance_sample\` DROP FOREIGN KEY \`FK_015ef7525bc89570435d9757eab\``);
    await q.query(`ALTER TABLE \`data_import\` DROP FOREIGN KEY \`FK_fd78045ff53c16ce0154412836d\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP FOREIGN KEY \`FK_d9c7107b9edad7e5777fd59aba4\``);
    await q.query(`ALTER TABLE \`generating_unit\` DROP FOREIGN KEY \`FK_ee7b5d1a4e05343b0f676c5432d\``);
    await q.query(`ALTER TABLE \`plant\` DROP FOREIGN KEY \`FK_df448105b774d90ab97b801f4d5\``);
    await q.query(`ALTER TABLE \`plant\` DROP FOREIGN KEY \`FK_2d1b27c8fc97767f47a8e2ebf07\``);
    await q.query(`ALTER TABLE \`cleaning_method\` DROP FOREIGN KEY \`FK_f9c84ddf1ae04d66087b7446293\``);
    await q.query(`DROP INDEX \`IDX_e560d75e6d044050f5ccc4888e\` ON \`unit_event\``);
    await q.query(`DROP TABLE \`unit_event\``);
    await q.query(`DROP INDEX \`IDX_d1148df7562438e4a6b7b5881c\` ON \`performance_sample\``);
    await q.query(`DROP INDEX \`IDX_1a958db7adedba0ee378147aac\` ON \`performance_sample\``);
    await q.query(`DROP TABLE \`performance_sample\``);
    await q.query(`DROP INDEX \`IDX_cced27b64dbe0e0c881b6948b9\` ON \`data_import\``);
    await q.query(`DROP TABLE \`data_import\``);
    await q.query(`DROP TABLE \`daily_aggregate\``);
    await q.query(`DROP INDEX \`IDX_0a4f4fc3d3f2a10ab00440f3eb\` ON \`generating_unit\``);
    await q.query(`DROP TABLE \`generating_unit\``);
    await q.query(`DROP INDEX \`IDX_881eef48588c106579de84c71e\` ON \`plant\``);
    await q.query(`DROP TABLE \`plant\``);
    await q.query(`DROP INDEX \`IDX_c3cfdf626f48e86793b947c445\` ON \`cleaning_method\``);
    await q.query(`DROP TABLE \`cleaning_method\``);
    await q.query(`DROP INDEX \`IDX_df19134678c388fed8956f5eb9\` ON \`background_job\``);
    await q.query(`DROP TABLE \`background_job\``);
  }
}
