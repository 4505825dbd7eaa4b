// Creates the database if needed, runs migrations and (with --seed) seeds the demo once.
//   --fresh  drop and recreate the database first (throwaway test databases)
//   --drop   drop the database and stop
//   --quiet  with --seed: do not print the demo accounts
import { setUpDatabase } from '../database-setup';

const args = new Set(process.argv.slice(2));
try {
  await setUpDatabase(process.env.DATABASE_URL, {
    drop: args.has('--drop'),
    fresh: args.has('--fresh'),
    seed: args.has('--seed'),
    quiet: args.has('--quiet'),
  });
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}
