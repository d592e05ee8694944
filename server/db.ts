import { Sequelize } from 'sequelize';
import type { Config } from './config';

/** One Sequelize instance per process, on the private MariaDB instance. */
export function createDatabase(config: Config, logging: false | ((sql: string) => void) = false): Sequelize {
  return new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    host: config.DB_HOST,
    port: config.DB_PORT,
    dialect: 'mariadb',
    logging,
    pool: { max: 10, min: 0, idle: 10000 },
    dialectOptions: { connectTimeout: 5000 },
    define: { underscored: true },
  });
}

export async function databaseUp(db: Sequelize): Promise<boolean> {
  try {
    await db.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
