import type { RequestHandler } from 'express';
import type { Access } from '@shared/schemas/access';
import { roleLabels, teamRoleAtLeast } from '@shared/schemas/roles';
import type { AppDeps } from '../context';
import { AppError } from '../errors';
import { isProposer, teamRoleOf } from '../services/membership.service';
import { serviceContext } from './service-context';

/**
 * Enforces a route's access level: 401 when nobody is signed in, 403 when the role is missing
 * (`proposer`: a curator, or a member or team admin of some team).
 * On team routes the caller's role in :teamId is left in res.locals.teamRole.
 */
export function requireAccess(access: Access, deps: AppDeps): RequestHandler {
  return async (req, res, next) => {
    res.locals.teamRole = null;
    if (access === 'public') return next();
    const principal = res.locals.principal;
    if (!principal) throw new AppError('unauthenticated', 'Sign in first, or send an API token.');
    if (access === 'signed_in') return next();
    if (access === 'proposer') {
      if (!(await isProposer(serviceContext(deps, req, res)))) {
        throw new AppError(
          'forbidden',
          'Proposing library changes needs the role Member (or Team admin) in a team, or the site role Curator.',
        );
      }
      return next();
    }
    if ('site' in access) {
      if (!principal.user.siteRoles.includes(access.site)) {
        throw new AppError('forbidden', `Only a ${roleLabels[access.site].toLowerCase()} may do this.`);
      }
      return next();
    }
    const teamId = req.params['teamId'];
    if (typeof teamId !== 'string') throw new Error('Team route without :teamId');
    const role = await teamRoleOf(serviceContext(deps, req, res), { teamId });
    if (!role) throw new AppError('forbidden', 'You are not a member of this team.');
    if (!teamRoleAtLeast(role, access.team)) {
      throw new AppError(
        'forbidden',
        `This needs the team role ${roleLabels[access.team]} or above; you are ${roleLabels[role]}.`,
        { required: access.team, held: role },
      );
    }
    res.locals.teamRole = role;
    next();
  };
}
