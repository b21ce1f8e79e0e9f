import {
  invitationListSchema,
  invitationPreviewSchema,
  invitationSchema,
  teamMemberSchema,
  teamMemberListSchema,
  teamSchema,
  type AcceptInvitationInput,
  type CreateInvitationInput,
  type Invitation,
  type InvitationPreview,
  type Team,
  type TeamMember,
  type UpdateMemberInput,
} from '@shared/schemas/teams';
import { sessionInfoSchema, type SessionInfo } from '@shared/schemas/session';
import { http } from './http';

const teamPath = (teamId: string) => `/teams/${encodeURIComponent(teamId)}`;

/** One team the caller belongs to. */
export function getTeam(teamId: string): Promise<Team> {
  return http.get(teamPath(teamId), { schema: teamSchema });
}

/** Members of a team with their roles. */
export async function listMembers(teamId: string): Promise<TeamMember[]> {
  return (await http.get(`${teamPath(teamId)}/members`, { schema: teamMemberListSchema })).members;
}

/** Changes a member's role (team admin only). */
export function updateMember(teamId: string, userId: string, input: UpdateMemberInput): Promise<TeamMember> {
  return http.patch(`${teamPath(teamId)}/members/${encodeURIComponent(userId)}`, input, { schema: teamMemberSchema });
}

/** Removes a member from the team (team admin only). */
export function removeMember(teamId: string, userId: string): Promise<void> {
  return http.delete(`${teamPath(teamId)}/members/${encodeURIComponent(userId)}`);
}

/** Invitations of a team, pending and accepted. */
export async function listInvitations(teamId: string): Promise<Invitation[]> {
  return (await http.get(`${teamPath(teamId)}/invitations`, { schema: invitationListSchema })).invitations;
}

/** Invites someone by e-mail with a role; the server e-mails the link. */
export function createInvitation(teamId: string, input: CreateInvitationInput): Promise<Invitation> {
  return http.post(`${teamPath(teamId)}/invitations`, input, { schema: invitationSchema });
}

/** Withdraws a pending invitation. */
export function revokeInvitation(teamId: string, invitationId: string): Promise<void> {
  return http.delete(`${teamPath(teamId)}/invitations/${encodeURIComponent(invitationId)}`);
}

/** What an invitation offers, read by its token (public). */
export function getInvitationPreview(token: string): Promise<InvitationPreview> {
  return http.get(`/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema });
}

/** Accepts an invitation; signs in as the (new or existing) account. */
export function acceptInvitation(token: string, input: AcceptInvitationInput): Promise<SessionInfo> {
  return http.post(`/invitations/${encodeURIComponent(token)}/accept`, input, { schema: sessionInfoSchema });
}
