import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { IDEMPOTENCY_HEADER, idempotencyKeySchema } from '../../shared/api/job-sheet';
import { BadRequestError, ConflictError } from './errors';
import type { SessionUser } from '../types';

export type StoredResult = { status: number; body: unknown };

/** The request's Idempotency-Key header, checked; undefined when absent. */
export function readIdempotencyKey(header: string | undefined): string | undefined {
  if (header === undefined || header === '') return undefined;
  const r = idempotencyKeySchema.safeParse(header);
  if (!r.success) throw new BadRequestError(r.error.issues[0].message, 'bad_idempotency_key');
  return r.data;
}

/**
 * Runs `work` once per (user, key): the first call's result is stored in the same transaction and
 * every repeat gets that stored result instead of doing the work again. Two requests racing with
 * one key: PostgreSQL makes the second INSERT wait for the first transaction, then it finds the row.
 * Without a key the work simply runs (inside a transaction).
 */
export async function runOnce(
  sequelize: Sequelize,
  user: SessionUser,
  key: string | undefined,
  scope: string,
  work: (t: Transaction) => Promise<StoredResult>,
): Promise<StoredResult & { replayed: boolean }> {
  if (!key) {
    const r = await sequelize.transaction((t) => work(t));
    return { ...r, replayed: false };
  }
  return sequelize.transaction(async (t) => {
    const claimed = await sequelize.query<{ key: string }>(
      `INSERT INTO idempotency_keys (user_id, key, organisation_id, scope, status_code, response)
       VALUES (:userId, :key, :orgId, :scope, 0, NULL)
       ON CONFLICT (user_id, key) DO NOTHING RETURNING key`,
      { replacements: { userId: user.id, key, orgId: user.organisationId, scope }, type: QueryTypes.SELECT, transaction: t },
    );
    if (claimed.length === 0) {
      const [row] = await sequelize.query<{ scope: string; status_code: number; response: unknown }>(
        'SELECT scope, status_code, response FROM idempotency_keys WHERE user_id = :userId AND key = :key',
        { replacements: { userId: user.id, key }, type: QueryTypes.SELECT, transaction: t },
      );
      if (!row || row.scope !== scope) {
        throw new ConflictError(`this ${IDEMPOTENCY_HEADER} was already used for another request`, 'idempotency_key_reused');
      }
      return { status: row.status_code, body: row.response, replayed: true };
    }
    const result = await work(t);
    await sequelize.query('UPDATE idempotency_keys SET status_code = :status, response = CAST(:body AS jsonb) WHERE user_id = :userId AND key = :key', {
      replacements: { status: result.status, body: JSON.stringify(result.body ?? null), userId: user.id, key },
      transaction: t,
    });
    return { ...result, replayed: false };
  });
}
