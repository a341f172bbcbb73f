import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { DataSource } from 'typeorm';
import type { MysqlDriver } from 'typeorm/driver/mysql/MysqlDriver.js';

/**
 * Sessions in MariaDB, on the data source's own connection pool: one pool per process, so any process
 * behind a load balancer reads a session another made. Closing the store leaves the pool to the data source.
 */
export function createSessionStore(ds: DataSource) {
  const MySQLStore = MySQLStoreFactory(session);
  return new MySQLStore(
    {
      createDatabaseTable: false,
      clearExpired: true,
      checkExpirationInterval: 15 * 60 * 1000,
      endConnectionOnClose: false,
      schema: { tableName: 'sessions', columnNames: { session_id: 'session_id', expires: 'expires', data: 'data' } },
    },
    // The store calls query(sql, params, callback): the callback-style pool under TypeORM's driver answers that.
    (ds.driver as MysqlDriver).pool as never,
  );
}
