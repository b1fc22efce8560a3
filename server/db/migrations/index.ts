import type { QueryInterface } from 'sequelize';
import type { RunnableMigration } from 'umzug';
import * as m0001 from './0001-foundation';
import * as m0100 from './0100-quotes-settings';
import * as m0200 from './0200-installer';
import * as m0400 from './0400-payments';
import * as m0500 from './0500-min-offcut-length';
import * as m0501 from './0501-mail-queue';
import * as m0502 from './0502-login-limits';
import * as m0503 from './0503-eaves-hatch-settings';
import * as m0504 from './0504-space-soft-delete';
import * as m0505 from './0505-mail-waiting-index';
import * as m0506 from './0506-job-actuals';
import * as m0507 from './0507-actuals-edits';
import * as m0508 from './0508-takeoff-format-column';
import * as m0509 from './0509-job-event-order';

type Migration = RunnableMigration<QueryInterface>;
const entry = (name: string, mod: { up: Migration['up']; down?: Migration['down'] }): Migration => ({ name, up: mod.up, down: mod.down });

/**
 * Every migration, in order: one sequence, each new one numbered after the highest here, named by
 * its topic. An explicit array (not a glob) so it works under tsx and vitest alike. The names are
 * what schema_migrations records, so a migration on main is never renamed or edited.
 */
export const MIGRATIONS: Migration[] = [
  entry('0001-foundation', m0001),
  entry('0100-quotes-settings', m0100),
  entry('0200-installer', m0200),
  entry('0400-payments', m0400),
  entry('0500-min-offcut-length', m0500),
  entry('0501-mail-queue', m0501),
  entry('0502-login-limits', m0502),
  entry('0503-eaves-hatch-settings', m0503),
  entry('0504-space-soft-delete', m0504),
  entry('0505-mail-waiting-index', m0505),
  entry('0506-job-actuals', m0506),
  entry('0507-actuals-edits', m0507),
  entry('0508-takeoff-format-column', m0508),
  entry('0509-job-event-order', m0509),
];
