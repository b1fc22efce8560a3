import { QueryTypes, type Sequelize } from 'sequelize';
import { can } from '../../../shared/auth/policies';
import { NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';

/** A space with its job's access facts and its latest revision (plan and takeoff), read in one query. */
export interface SpacePlanRow {
  id: string;
  name: string;
  jobId: string;
  jobReference: string;
  revision: number | null;
  plan: unknown;
  takeoff: unknown;
  createdAt: Date | null;
}

// The editor's read is the hottest authenticated GET: one round trip for the space, the job that
// decides access and the newest revision (the (space_id, revision) index serves the LIMIT 1).
const SQL = `
  SELECT s.id, s.name, s.job_id AS "jobId", j.reference AS "jobReference", j.organisation_id AS "jobOrganisationId",
         j.assigned_installer_id AS "assignedInstallerId", r.revision, r.plan, r.takeoff, r.created_at AS "createdAt"
  FROM spaces s
  JOIN jobs j ON j.id = s.job_id
  LEFT JOIN LATERAL (
    SELECT revision, plan, takeoff, created_at FROM plan_revisions WHERE space_id = s.id ORDER BY revision DESC LIMIT 1
  ) r ON true
  WHERE s.id = $1 AND s.organisation_id = $2 AND s.deleted_at IS NULL`;

/** The space and its latest revision when the actor may see its job; a 404 like a missing id otherwise. */
export async function readSpacePlan(sequelize: Sequelize, actor: SessionUser, spaceId: string): Promise<SpacePlanRow> {
  const [row] = await sequelize.query<SpacePlanRow & { jobOrganisationId: string; assignedInstallerId: string | null }>(SQL, {
    bind: [spaceId, actor.organisationId],
    type: QueryTypes.SELECT,
  });
  if (!row || !can(actor, 'jobs:read', { organisationId: row.jobOrganisationId, assignedInstallerId: row.assignedInstallerId }))
    throw new NotFoundError('space');
  const { jobOrganisationId: _o, assignedInstallerId: _a, ...plan } = row;
  return plan;
}
