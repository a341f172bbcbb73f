import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { ENTITIES } from './entities/index.js';
import { MIGRATIONS } from './migrations/index.js';

export interface DbConnection {
  host: string;
  port: number;
  database: string;
  user: string;
  password: string;
}

/** Migrations only: `synchronize` stays off everywhere. */
export function buildDataSource(db: DbConnection): DataSource {
  return new DataSource({
    type: 'mariadb',
    host: db.host,
    port: db.port,
    username: db.user,
    password: db.password,
    database: db.database,
    charset: 'utf8mb4_unicode_ci',
    timezone: 'Z',
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsTableName: 'migrations',
    synchronize: false,
    logging: false,
    extra: { connectionLimit: 10 },
  });
}
