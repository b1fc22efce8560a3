import { JOB_STAGES, type JobListQuery } from '../../../shared/api/jobs';
import { fieldError } from '../../lib/errors';

type Sort = NonNullable<JobListQuery['sort']>;
type Dir = 'asc' | 'desc';

const STAGE_POSITION = `array_position(ARRAY[${JOB_STAGES.map((s) => `'${s}'`).join(',')}]::varchar[], "Job"."stage")`;

/**
 * The SQL expression each sort orders by, and the type its cursor value is cast back to. Times are
 * cut to milliseconds so that the value a cursor carries (a JavaScript date) equals the database's.
 * Jobs without an install date come last in both directions (as NULLS LAST did).
 */
function keyOf(sort: Sort, dir: Dir): { sql: string; cast: string } {
  switch (sort) {
    case 'created':
      return { sql: `date_trunc('milliseconds', "Job"."created_at")`, cast: 'timestamptz' };
    case 'stage':
      return { sql: STAGE_POSITION, cast: 'int' };
    case 'customer':
      return { sql: `"customer"."name"`, cast: 'text' };
    case 'installDate':
      return { sql: `COALESCE("Job"."install_date", '${dir === 'asc' ? '9999-12-31' : '0001-01-01'}'::date)`, cast: 'date' };
    default:
      return { sql: `date_trunc('milliseconds', "Job"."updated_at")`, cast: 'timestamptz' };
  }
}

type Cursor = { s: Sort; d: Dir; k: string | number; id: string };

/** An opaque cursor for the row after which the next page starts. */
export function encodeCursor(sort: Sort, dir: Dir, key: unknown, id: string): string {
  const k = key instanceof Date ? key.toISOString() : (key as string | number);
  return Buffer.from(JSON.stringify({ s: sort, d: dir, k, id } satisfies Cursor)).toString('base64url');
}

function decodeCursor(cursor: string, sort: Sort, dir: Dir): Cursor {
  let c: Cursor;
  try {
    c = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
  } catch {
    throw fieldError('cursor', 'this cursor is not one the jobs list gave out; start again from the first page');
  }
  const idOk = typeof c?.id === 'string' && /^[0-9a-f-]{36}$/i.test(c.id);
  const keyOk = typeof c?.k === 'string' || typeof c?.k === 'number';
  if (!idOk || !keyOk) throw fieldError('cursor', 'this cursor is not one the jobs list gave out; start again from the first page');
  if (c.s !== sort || c.d !== dir) throw fieldError('cursor', 'this cursor belongs to another order of the list; start again from the first page');
  return c;
}

/**
 * Keyset paging of the jobs list: ordered by the sort's key then the id (a total order), each page
 * starting strictly after the previous page's last row, so jobs added or changed meanwhile never
 * make a page repeat or skip another job. Returns the key's SQL (over "Job" and "customer"), the
 * direction, and (with a cursor) the comparison and values for the rows after it.
 */
export function keysetFor(query: { sort?: Sort; dir?: Dir; cursor?: string }) {
  const sort = query.sort ?? 'updated';
  const dir = query.dir ?? 'desc';
  const key = keyOf(sort, dir);
  // Spelled out, never copied from the query: this goes into the SQL text.
  const DIR = dir === 'asc' ? 'ASC' : 'DESC';
  let after: { cmp: '<' | '>'; cast: string; key: string; id: string } | null = null;
  if (query.cursor) {
    const c = decodeCursor(query.cursor, sort, dir);
    after = { cmp: dir === 'desc' ? '<' : '>', cast: key.cast, key: String(c.k), id: c.id };
  }
  // The cursor carries the key as the list read it: dates as text, times as instants, stages as numbers.
  const keyValue = key.cast === 'date' ? `(${key.sql})::text` : key.sql;
  return { sort, dir, DIR, keySql: key.sql, keyValue, after };
}
