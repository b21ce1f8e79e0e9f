import { z } from 'zod';
import { siteRoleSchema, teamRoleSchema, type SiteRole, type TeamRole } from './roles';

/**
 * Who may call an API route or open a client page: anyone; anyone signed in; proposers (members
 * or team admins of at least one team, and curators: those who may propose library changes);
 * members of the team in the path with at least the given role; or holders of a site role. A site
 * admin has no automatic team access, and the site roles do not include each other.
 */
export type Access = 'public' | 'signed_in' | 'proposer' | { team: TeamRole } | { site: SiteRole };

export const accessSchema: z.ZodType<Access> = z.union([
  z.literal('public'),
  z.literal('signed_in'),
  z.literal('proposer'),
  z.object({ team: teamRoleSchema }).strict(),
  z.object({ site: siteRoleSchema }).strict(),
]);

/** Plain words for an access level, for error messages and the OpenAPI document. */
export function describeAccess(access: Access): string {
  if (access === 'public') return 'anyone';
  if (access === 'signed_in') return 'any signed-in user';
  if (access === 'proposer') return 'members or team admins of at least one team, and curators';
  if ('team' in access) return `team members with role ${access.team} or above`;
  return `users with the site role ${access.site}`;
}
