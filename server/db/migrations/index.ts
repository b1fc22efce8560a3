import type { QueryInterface } from 'sequelize';
import type { RunnableMigration } from 'umzug';
import * as m0001 from './0001-foundation';
import * as m0100 from './0100-quotes-settings';
import * as m0200 from './0200-installer';
import * as m0400 from './0400-payments';

type Migration = RunnableMigration<QueryInterface>;
const entry = (name: string, mod: { up: Migration['up']; down?: Migration['down'] }): Migration => ({ name, up: mod.up, down: mod.down });

/**
 * Every migration, in order. An explicit array (not a glob) so it works under tsx and vitest alike.
 * Ranges: server foundation 0001–0099, quotes/settings 0100–0199, installer 0200–0299,
 * editor 0300–0399, payments 0400–0499. Append; never edit another range's migration.
 */
export const MIGRATIONS: Migration[] = [
  entry('0001-foundation', m0001),
  // append below
  entry('0100-quotes-settings', m0100), // quotes engineer
  entry('0200-installer', m0200), // installer engineer
  entry('0400-payments', m0400), // payments engineer
];
