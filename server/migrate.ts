import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize, QueryInterface } from 'sequelize';

export type Migration = { up(qi: QueryInterface, S: typeof import('sequelize')): Promise<void>; down?(qi: QueryInterface, S: typeof import('sequelize')): Promise<void> };

/** Umzug over the files in server/migrations (run in name order; applied names kept in SequelizeMeta). */
export function createMigrator(db: Sequelize) {
  const Sequelize = require('sequelize') as typeof import('sequelize');
  return new Umzug({
    migrations: {
      glob: ['migrations/*.ts', { cwd: __dirname, ignore: ['**/*.d.ts'] }],
      resolve: ({ name, path: file }) => {
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        const mod = require(file!) as Migration;
        return { name: path.basename(name, '.ts'), up: () => mod.up(db.getQueryInterface(), Sequelize), down: async () => mod.down?.(db.getQueryInterface(), Sequelize) };
      },
    },
    storage: new SequelizeStorage({ sequelize: db }),
    context: db.getQueryInterface(),
    logger: undefined,
  });
}

export async function migrate(db: Sequelize): Promise<string[]> {
  const done = await createMigrator(db).up();
  return done.map((m) => m.name);
}
