import { randomUUID } from 'node:crypto';
import type { InviteUserBody, UpdateUserBody, User as UserDto } from '../../../shared/api/users';
import type { AppDeps } from '../../deps';
import { User } from '../../db/models';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import type { AuthService } from '../auth/auth.service';

/**
 * The least time an invite takes to answer, ms: longer than either path takes on a quiet machine,
 * so a new invite and one for an address used by another company cannot be told apart by timing.
 */
export const INVITE_ANSWER_FLOOR_MS = 300;

export function toUserDto(u: User): UserDto {
  return { id: u.id, email: u.email, name: u.name, role: u.role, active: u.active, hasPassword: !!u.passwordHash, createdAt: u.createdAt.toISOString() };
}

export function createUsersService(_deps: AppDeps, auth: AuthService) {
  async function findInOrg(actor: SessionUser, id: string) {
    const user = await User.findOne({ where: { id, organisationId: actor.organisationId } });
    if (!user) throw new NotFoundError('user');
    return user;
  }

  return {
    async list(actor: SessionUser): Promise<UserDto[]> {
      const users = await User.findAll({
        where: { organisationId: actor.organisationId },
        order: [
          ['active', 'DESC'],
          ['name', 'ASC'],
        ],
      });
      return users.map(toUserDto);
    },

    async get(actor: SessionUser, id: string): Promise<UserDto> {
      return toUserDto(await findInOrg(actor, id));
    },

    /**
     * Creates the user without a password and e-mails a single-use link to set one. An address that
     * already has an account with another company gets the same answer (nothing is created or
     * changed for it; its holder is told by e-mail instead), so an invite never reveals who uses
     * Quiltline elsewhere. Only a user of the inviter's own company, whom the inviter can see in
     * the users list anyway, is a 409. Both answers wait to the same floor so timing tells nothing.
     */
    async invite(actor: SessionUser, body: InviteUserBody): Promise<UserDto> {
      const started = Date.now();
      const existing = await User.findOne({ where: { email: body.email } });
      if (existing && existing.organisationId === actor.organisationId) {
        throw new ConflictError('a user of your company already has this e-mail', 'email_taken', [{ path: 'email', message: 'this e-mail is already in use' }]);
      }
      let answer: UserDto;
      if (existing) {
        await auth.sendInviteElsewhereNotice(existing, actor.organisationName, actor.name);
        const now = new Date();
        answer = { id: randomUUID(), email: body.email, name: body.name, role: body.role, active: true, hasPassword: false, createdAt: now.toISOString() };
      } else {
        const user = await User.create({ organisationId: actor.organisationId, email: body.email, name: body.name, role: body.role, passwordHash: null });
        await auth.sendInvite(user, actor.organisationName, actor.name);
        answer = toUserDto(user);
      }
      const wait = INVITE_ANSWER_FLOOR_MS - (Date.now() - started);
      if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait));
      return answer;
    },

    /** Sends a fresh invite link to a user who has not set a password yet. */
    async resendInvite(actor: SessionUser, id: string): Promise<UserDto> {
      const user = await findInOrg(actor, id);
      if (user.passwordHash) throw new ConflictError('this user has already set a password; they can use "forgot password"', 'already_active');
      await auth.sendInvite(user, actor.organisationName, actor.name);
      return toUserDto(user);
    },

    /** Name, role, active. Deactivating ends the user's sessions at once. */
    async update(actor: SessionUser, id: string, patch: UpdateUserBody): Promise<UserDto> {
      const user = await findInOrg(actor, id);
      if (user.id === actor.id && (patch.active === false || (patch.role && patch.role !== user.role))) {
        // Keeps at least this office user able to manage the company.
        throw new ConflictError('you cannot deactivate yourself or change your own role; ask another office user', 'cannot_change_self');
      }
      await user.update(patch);
      if (patch.active === false) await auth.destroySessionsOf(user.id);
      return toUserDto(user);
    },
  };
}
