import { QueryTypes, type Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize';

/** Next job reference for a company, e.g. JOB-2026-0001 (its own prefix, so it never reads like a quote number QT-0001): numbered per company and calendar year, atomic. */
export async function nextJobReference(sequelize: Sequelize, organisationId: string, transaction?: Transaction, now = new Date()): Promise<string> {
  const year = now.getUTCFullYear();
  const [row] = await sequelize.query<{ last_number: number }>(
    `INSERT INTO job_reference_counters (organisation_id, year, last_number) VALUES (:organisationId, :year, 1)
     ON CONFLICT (organisation_id, year) DO UPDATE SET last_number = job_reference_counters.last_number + 1
     RETURNING last_number`,
    { replacements: { organisationId, year }, type: QueryTypes.SELECT, transaction },
  );
  return `JOB-${year}-${String(row.last_number).padStart(4, '0')}`;
}
