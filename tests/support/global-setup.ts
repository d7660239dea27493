// Runs once before the suites: applies the migrations to the throwaway database.
import { runMigrations } from '../../scripts/lib/migrate';

export default async function setup() {
  if (process.env.DATABASE_URL) await runMigrations(process.env.DATABASE_URL);
}
