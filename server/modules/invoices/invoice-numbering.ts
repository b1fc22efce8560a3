import { QueryTypes, type Transaction } from 'sequelize';
import type { AppDeps } from '../../deps';

/** The two numbering series of a company: invoices and credit notes never share a number. */
export const SERIES = { invoice: 'INV', credit_note: 'CN' } as const;
export const formatNumber = (series: string, n: number) => `${series}-${String(n).padStart(6, '0')}`;

/**
 * Takes the next number of a company's series inside the caller's transaction. The UPDATE locks the
 * counter row until commit, so concurrent creators queue; a rolled-back insert gives its number back.
 */
export async function takeNumber(deps: Pick<AppDeps, 'sequelize'>, organisationId: string, series: string, t: Transaction): Promise<number> {
  const s = deps.sequelize;
  await s.query('INSERT INTO invoice_counters (organisation_id, series, next_number) VALUES (:org, :series, 1) ON CONFLICT DO NOTHING', {
    replacements: { org: organisationId, series },
    transaction: t,
  });
  const rows = await s.query<{ n: number }>(
    'UPDATE invoice_counters SET next_number = next_number + 1 WHERE organisation_id = :org AND series = :series RETURNING next_number - 1 AS n',
    { replacements: { org: organisationId, series }, type: QueryTypes.SELECT, transaction: t },
  );
  return Number(rows[0].n);
}
