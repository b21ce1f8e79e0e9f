import { z } from 'zod';

/** Team roles, weakest first: each includes the powers of the ones before it. */
export const teamRoles = ['viewer', 'member', 'team_admin'] as const;
export const teamRoleSchema = z.enum(teamRoles);
export type TeamRole = z.infer<typeof teamRoleSchema>;

/** Installation roles: powers over what all teams share (the library, users, teams). */
export const siteRoles = ['curator', 'site_admin'] as const;
export const siteRoleSchema = z.enum(siteRoles);
export type SiteRole = z.infer<typeof siteRoleSchema>;

/** True when `held` is at least `required` in the team-role order. */
export function teamRoleAtLeast(held: TeamRole, required: TeamRole): boolean {
  return teamRoles.indexOf(held) >= teamRoles.indexOf(required);
}

/** Human labels for roles, shown in the client. */
export const roleLabels: Record<TeamRole | SiteRole, string> = {
  viewer: 'Viewer',
  member: 'Member',
  team_admin: 'Team admin',
  curator: 'Curator',
  site_admin: 'Site admin',
};
