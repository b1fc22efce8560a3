import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { QueryTypes } from 'sequelize';
import { AUTH_LINK_PATHS } from '../../../shared/api/auth';
import type { AppDeps } from '../../deps';
import { AuthToken, Organisation, User, type AuthTokenPurpose } from '../../db/models';
import { BadRequestError } from '../../lib/errors';
import type { SessionUser } from '../../types';

export const TOKEN_TTL_MS: Record<AuthTokenPurpose, number> = {
  invite: 7 * 24 * 3600_000,
  reset: 60 * 60_000,
};

// Compared against when the e-mail is unknown, so a wrong e-mail costs as long as a wrong password.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', 10);

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function toSessionUser(user: User, organisation: Organisation): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organisationId: organisation.id,
    organisationName: organisation.name,
  };
}

export function createAuthService(deps: Pick<AppDeps, 'config' | 'mailer' | 'sequelize'>) {
  const { config, mailer, sequelize } = deps;

  async function hashPassword(password: string) {
    return bcrypt.hash(password, config.bcryptRounds);
  }

  /** The user for these credentials, or null (unknown e-mail, wrong password, inactive, no password yet). */
  async function verifyCredentials(email: string, password: string): Promise<SessionUser | null> {
    const user = await User.findOne({ where: { email: email.toLowerCase() }, include: [{ model: Organisation, as: 'organisation' }] });
    const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !user.passwordHash || !ok || !user.active || !user.organisation) return null;
    return toSessionUser(user, user.organisation);
  }

  /** Loads the session's user afresh on every request: a deactivated user is signed out at once. */
  async function loadSessionUser(id: string): Promise<SessionUser | null> {
    const user = await User.findByPk(id, { include: [{ model: Organisation, as: 'organisation' }] });
    if (!user || !user.active || !user.organisation) return null;
    return toSessionUser(user, user.organisation);
  }

  /** Creates a single-use token; returns the raw value (only its hash is stored). */
  async function issueToken(user: User, purpose: AuthTokenPurpose): Promise<string> {
    const token = randomBytes(32).toString('base64url');
    await AuthToken.create({
      organisationId: user.organisationId,
      userId: user.id,
      purpose,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + TOKEN_TTL_MS[purpose]),
      usedAt: null,
    });
    return token;
  }

  function linkFor(purpose: AuthTokenPurpose, token: string) {
    return `${config.appUrl}${AUTH_LINK_PATHS[purpose]}?token=${encodeURIComponent(token)}`;
  }

  async function sendInvite(user: User, organisationName: string, invitedBy: string) {
    const link = linkFor('invite', await issueToken(user, 'invite'));
    await mailer.send({
      to: user.email,
      organisationId: user.organisationId,
      subject: `You're invited to ${organisationName} on Quiltline`,
      text:
        `Hello ${user.name},\n\n${invitedBy} has invited you to join ${organisationName} on Quiltline as ${user.role}.\n\n` +
        `Choose your password here (the link works once and expires in 7 days):\n${link}\n\n` +
        `If you were not expecting this, you can ignore this e-mail.\n`,
    });
  }

  /**
   * To the holder of an address another company tried to invite: no account was made or changed;
   * sent as mail about the holder's own account (their company's, like a reset), never the inviter's.
   */
  async function sendInviteElsewhereNotice(holder: User, organisationName: string, invitedBy: string) {
    await mailer.send({
      to: holder.email,
      organisationId: holder.organisationId,
      subject: `${organisationName} tried to invite you to Quiltline`,
      text:
        `Hello ${holder.name},\n\n${invitedBy} of ${organisationName} tried to invite this address to join ${organisationName} on Quiltline.\n\n` +
        `This address already has a Quiltline account with another company, so no new account was made and yours is unchanged. ` +
        `If you mean to join ${organisationName}, ask them to invite you with a different e-mail address.\n\n` +
        `If you were not expecting this, you can ignore this e-mail.\n`,
    });
  }

  /** Always resolves the same way whether or not the e-mail is known (no account enumeration). */
  async function requestPasswordReset(email: string): Promise<void> {
    const user = await User.findOne({ where: { email: email.toLowerCase() } });
    if (!user || !user.active) return;
    const link = linkFor('reset', await issueToken(user, 'reset'));
    await mailer.send({
      to: user.email,
      organisationId: user.organisationId,
      subject: 'Reset your Quiltline password',
      text:
        `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset your Quiltline password.\n\n` +
        `Choose a new password here (the link works once and expires in 1 hour):\n${link}\n\n` +
        `If you did not ask for this, ignore this e-mail: your password stays as it is.\n`,
    });
  }

  /** Sets the password from an invite or reset token; the token (and any other open one) is used up. */
  async function setPasswordFromToken(token: string, password: string): Promise<{ email: string }> {
    const passwordHash = await hashPassword(password);
    return sequelize.transaction(async (transaction) => {
      const row = await AuthToken.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
      if (!row || row.usedAt || row.expiresAt.getTime() < Date.now()) {
        throw new BadRequestError('this link is invalid, has expired or has already been used; ask for a new one', 'invalid_token');
      }
      const user = await User.findByPk(row.userId, { transaction });
      if (!user || !user.active) throw new BadRequestError('this account is not active', 'invalid_token');
      await user.update({ passwordHash }, { transaction });
      await AuthToken.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
      await destroySessionsOf(user.id);
      return { email: user.email };
    });
  }

  /** Ends every session of a user (password change, deactivation). */
  async function destroySessionsOf(userId: string): Promise<void> {
    await sequelize.query(`DELETE FROM "session" WHERE sess->'passport'->>'user' = :userId`, {
      replacements: { userId },
      type: QueryTypes.DELETE,
    });
  }

  return {
    hashPassword,
    verifyCredentials,
    loadSessionUser,
    issueToken,
    sendInvite,
    sendInviteElsewhereNotice,
    requestPasswordReset,
    setPasswordFromToken,
    destroySessionsOf,
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
