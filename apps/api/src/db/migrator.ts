import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { REPO_ROOT } from '../config';

type Step = (params: { context: QueryInterface }) => Promise<void>;
interface StepModule {
  up: Step;
  down?: Step;
}

function stepsIn(folder: string) {
  const dir = join(REPO_ROOT, 'db', folder);
  return readdirSync(dir)
    .filter((f) => /^\d{4}-.*\.ts$/.test(f))
    .sort()
    .map((file) => ({
      name: file.replace(/\.ts$/, ''),
      async up({ context }: { context: QueryInterface }) {
        const mod = (await import(pathToFileURL(join(dir, file)).href)) as StepModule;
        await mod.up({ context });
      },
      async down({ context }: { context: QueryInterface }) {
        const mod = (await import(pathToFileURL(join(dir, file)).href)) as StepModule;
        await mod.down?.({ context });
      },
    }));
}

/** Schema migrations from db/migrations, recorded in the `schema_migrations` table. */
export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: stepsIn('migrations'),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({
      sequelize,
      modelName: 'SchemaMigration',
      tableName: 'schema_migrations',
    }),
    logger: undefined,
  });
}

/** Demo seeders from db/seeders, run once each and recorded in `seed_runs`. */
export function seeder(sequelize: Sequelize) {
  return new Umzug({
    migrations: stepsIn('seeders'),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, modelName: 'SeedRun', tableName: 'seed_runs' }),
    logger: undefined,
  });
}
