import type { InviteUserBody, UpdateUserBody, User as UserDto } from '../../../shared/api/users';
import type { AppDeps } from '../../deps';
import { User } from '../../db/models';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import type { AuthService } from '../auth/auth.service';

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

    /** Creates the user without a password and e-mails a single-use link to set one. */
    async invite(actor: SessionUser, body: InviteUserBody): Promise<UserDto> {
      if (await User.findOne({ where: { email: body.email } })) {
        throw new ConflictError('a user with this e-mail already exists', 'email_taken', [{ path: 'email', message: 'this e-mail is already in use' }]);
      }
      const user = await User.create({ organisationId: actor.organisationId, email: body.email, name: body.name, role: body.role, passwordHash: null });
      await auth.sendInvite(user, actor.organisationName, actor.name);
      return toUserDto(user);
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
