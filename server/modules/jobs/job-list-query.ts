import { createHash } from 'node:crypto';
import pg from 'pg';
import type { Job as JobDto, JobListPage, JobListQuery } from '../../../shared/api/jobs';
import { JOB_PAGE_DEFAULT } from '../../../shared/api/jobs';
import { can } from '../../../shared/auth/policies';
import { redactPrices } from '../../lib/redact';
import type { SessionUser } from '../../types';
import { likePattern } from '../customers/customers.service';
import { encodeCursor, keysetFor } from './job-list-page';

interface Row {
  count: number;
  /** null on the one row of an empty page (it still carries the count). */
  id: string | null;
  reference: string;
  customerId: string;
  customerName: string;
  customerEmail: string;
  customerPhone: string;
  addressLine1: string;
  addressLine2: string;
  town: string;
  postcode: string;
  stage: JobDto['stage'];
  installerId: string | null;
  installerName: string | null;
  installDate: string | null;
  accessNotes: string;
  notes: string;
  createdAt: Date;
  updatedAt: Date;
  listKey: unknown;
  spaces: Array<{ id: string; name: string; latestRevision: number | null; latestRevisionAt: string | null; updatedAt: string }>;
}

// Times inside the spaces' JSON arrive as PostgreSQL's text, read by the same parser pg uses for a
// timestamptz column, so they come out exactly as the column values do.
const parseTimestamptz = pg.types.getTypeParser(pg.types.builtins.TIMESTAMPTZ, 'text') as (text: string) => Date;
const iso = (text: string) => parseTimestamptz(text).toISOString();

/**
 * GET /api/jobs in one round trip: the jobs matching the actor's scope, search and filters are
 * counted, the page after the cursor is cut from them in the list's order, and each job comes with
 * its customer, installer and spaces (in their order, each with its latest revision). Was a count,
 * a find with joins, the spaces and their revisions: four queries and a Sequelize model per row.
 */
export async function readJobListPage(pool: pg.Pool, actor: SessionUser, query: JobListQuery): Promise<JobListPage> {
  const values: unknown[] = [actor.organisationId];
  const param = (v: unknown) => `$${values.push(v)}`;
  const where = ['"Job".organisation_id = $1'];
  if (!can(actor, 'jobs:read-all')) where.push(`"Job".assigned_installer_id = ${param(actor.id)}`);
  if (query.stage) where.push(`"Job".stage = ${param(query.stage)}`);
  if (query.installerId && can(actor, 'jobs:read-all')) where.push(`"Job".assigned_installer_id = ${param(query.installerId)}`);
  if (query.q?.trim()) {
    const p = param(likePattern(query.q.trim()));
    where.push(
      `("Job".reference ILIKE ${p} OR "Job".address_line1 ILIKE ${p} OR "Job".town ILIKE ${p} OR "Job".postcode ILIKE ${p} OR "customer".name ILIKE ${p})`,
    );
  }
  const limit = Number(query.limit ?? JOB_PAGE_DEFAULT);
  const keyset = keysetFor(query);
  const after = keyset.after
    ? `WHERE (m.sort_key, m.id) ${keyset.after.cmp} (${param(keyset.after.key)}::${keyset.after.cast}, ${param(keyset.after.id)}::uuid)`
    : '';
  const text = `
    WITH matching AS (
      SELECT "Job".id, ${keyset.keySql} AS sort_key, ${keyset.keyValue} AS list_key
      FROM jobs "Job" LEFT JOIN customers "customer" ON "customer".id = "Job".customer_id AND "customer".organisation_id = "Job".organisation_id
      WHERE ${where.join(' AND ')}
    ), page AS (
      SELECT m.id, m.sort_key, m.list_key FROM matching m ${after} ORDER BY m.sort_key ${keyset.DIR}, m.id ${keyset.DIR} LIMIT ${param(limit + 1)}
    )
    SELECT t.count, x.* FROM (SELECT count(*)::int AS count FROM matching) t
    LEFT JOIN (
      SELECT j.id, j.reference, c.id AS "customerId", c.name AS "customerName", c.email AS "customerEmail", c.phone AS "customerPhone",
             j.address_line1 AS "addressLine1", j.address_line2 AS "addressLine2", j.town, j.postcode, j.stage,
             u.id AS "installerId", u.name AS "installerName", j.install_date::text AS "installDate",
             j.access_notes AS "accessNotes", j.notes, j.created_at AS "createdAt", j.updated_at AS "updatedAt",
             p.sort_key, p.list_key AS "listKey",
             (SELECT coalesce(json_agg(json_build_object('id', s.id, 'name', s.name, 'latestRevision', r.revision,
                       'latestRevisionAt', r.created_at::text, 'updatedAt', s.updated_at::text) ORDER BY s.position, s.created_at, s.id), '[]'::json)
                FROM spaces s
                LEFT JOIN LATERAL (SELECT revision, created_at FROM plan_revisions WHERE space_id = s.id AND organisation_id = s.organisation_id ORDER BY revision DESC LIMIT 1) r ON true
               WHERE s.job_id = j.id AND s.organisation_id = j.organisation_id AND s.deleted_at IS NULL) AS spaces
      FROM page p
      JOIN jobs j ON j.id = p.id
      -- Every join also keeps to the job's company: rows of another company never join, whatever the ids say.
      JOIN customers c ON c.id = j.customer_id AND c.organisation_id = j.organisation_id
      LEFT JOIN users u ON u.id = j.assigned_installer_id AND u.organisation_id = j.organisation_id
    ) x ON true
    ORDER BY x.sort_key ${keyset.DIR}, x.id ${keyset.DIR}`;
  const { rows } = await pool.query<Row>({ name: statementName(text), text, values });
  const found = rows.filter((r) => r.id !== null);
  const page = found.slice(0, limit);
  const last = page[page.length - 1];
  const nextCursor = found.length > limit ? encodeCursor(keyset.sort, keyset.dir, last.listKey, last.id!) : null;
  const jobs = page.map(toDto);
  return { jobs: can(actor, 'prices:read') ? jobs : jobs.map((d) => redactPrices(d)), nextCursor, count: rows[0].count };
}

function toDto(r: Row): JobDto {
  return {
    id: r.id!,
    reference: r.reference,
    customer: { id: r.customerId, name: r.customerName, email: r.customerEmail, phone: r.customerPhone },
    propertyAddress: { line1: r.addressLine1, line2: r.addressLine2, town: r.town, postcode: r.postcode },
    stage: r.stage,
    assignedInstaller: r.installerId ? { id: r.installerId, name: r.installerName! } : null,
    installDate: r.installDate,
    accessNotes: r.accessNotes,
    notes: r.notes,
    spaces: r.spaces.map((s) => ({
      id: s.id,
      name: s.name,
      latestRevision: s.latestRevision,
      latestRevisionAt: s.latestRevisionAt === null ? null : iso(s.latestRevisionAt),
      updatedAt: iso(s.updatedAt),
    })),
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

// A named statement is parsed and planned once per connection. The text differs by sort, direction,
// filters and cursor (a few hundred shapes at most), so it is named by its hash.
const names = new Map<string, string>();
function statementName(text: string): string {
  let name = names.get(text);
  if (!name) {
    name = `jobs-list-${createHash('sha1').update(text).digest('hex').slice(0, 16)}`;
    names.set(text, name);
  }
  return name;
}
