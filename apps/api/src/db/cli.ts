/**
 * `npm run db:migrate | db:seed | db:reset`: schema migrations and the demo seed against the
 * database named by the configuration (DATA_DIR/db.env or DB_* variables).
 */
import { loadConfig } from '../config';
import { connectDatabase } from './database';
import { migrator, seeder } from './migrator';

async function main(command: string | undefined): Promise<void> {
  const config = loadConfig();
  const sequelize = connectDatabase(config.db, { poolMax: 2 });
  try {
    if (command === 'migrate') {
      const done = await migrator(sequelize).up();
      console.log(
        `[db] migrations applied: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending'}`,
      );
    } else if (command === 'seed') {
      if (config.production) {
        console.log('[db] NODE_ENV=production: the demo seed is never loaded');
        return;
      }
      await migrator(sequelize).up();
      const done = await seeder(sequelize).up();
      console.log(
        `[db] seeders run: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending (already seeded)'}`,
      );
    } else if (command === 'reset') {
      if (config.production && process.env.RHOTRACE_ALLOW_RESET !== 'yes') {
        throw new Error('refusing to reset a production database (set RHOTRACE_ALLOW_RESET=yes)');
      }
      // One connection for all statements, so the foreign-key switch applies to every DROP.
      await sequelize.transaction(async (transaction) => {
        await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
        const [tables] = (await sequelize.query('SHOW TABLES', { transaction })) as [
          Record<string, string>[],
          unknown,
        ];
        for (const row of tables) {
          const name = Object.values(row)[0];
          if (name) await sequelize.query(`DROP TABLE \`${name}\``, { transaction });
        }
        await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
      });
      await migrator(sequelize).up();
      console.log('[db] database emptied and migrated');
    } else {
      throw new Error('usage: tsx apps/api/src/db/cli.ts migrate|seed|reset');
    }
  } finally {
    await sequelize.close();
  }
}

main(process.argv[2]).catch((error: unknown) => {
  console.error(`[db] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
