import { Sequelize } from 'sequelize';
import pg from 'pg';
import { initModels } from './models';

// DATE columns as plain 'YYYY-MM-DD' strings: no time zone shifts for install dates.
pg.types.setTypeParser(1082, (v: string) => v);

/** One Sequelize instance with every model registered. */
export function createSequelize(databaseUrl: string, opts: { logSql?: boolean; log?: (sql: string) => void } = {}): Sequelize {
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    // LOG_SQL: each statement through the server's logger (development only: statements carry data).
    logging: opts.logSql && opts.log ? opts.log : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
  initModels(sequelize);
  return sequelize;
}
