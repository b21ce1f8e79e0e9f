import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { useLocalStorage } from '@vueuse/core';
import type { Invitation, TeamMember, CreateInvitationInput } from '@shared/schemas/teams';
import type { TeamRole } from '@shared/schemas/roles';
import * as teamsApi from '@/api/teams';
import { useSessionStore } from './session';

const STORAGE_KEY = 'thermoledger.team';

/** The team being worked in (remembered across visits) and its members and invitations. */
export const useTeamsStore = defineStore('teams', () => {
  const session = useSessionStore();
  // Remembered across visits; without storage (private mode) the choice lasts for this visit.
  const chosenTeamId = useLocalStorage<string | null>(STORAGE_KEY, null, { writeDefaults: false });
  const members = ref<TeamMember[]>([]);
  const invitations = ref<Invitation[]>([]);
  const loadingMembers = ref(false);

  /** The chosen team if the user still belongs to it, else their first team. */
  const currentTeam = computed(() => {
    const teams = session.teams;
    return teams.find((t) => t.id === chosenTeamId.value) ?? teams[0] ?? null;
  });
  const currentRole = computed<TeamRole | null>(() => currentTeam.value?.role ?? null);

  function choose(teamId: string): void {
    chosenTeamId.value = teamId;
  }

  async function loadMembers(teamId: string, withInvitations: boolean): Promise<void> {
    loadingMembers.value = true;
    try {
      const [m, i] = await Promise.all([
        teamsApi.listMembers(teamId),
        withInvitations ? teamsApi.listInvitations(teamId) : Promise.resolve([]),
      ]);
      members.value = m;
      invitations.value = i;
    } finally {
      loadingMembers.value = false;
    }
  }

  async function changeRole(teamId: string, userId: string, role: TeamRole): Promise<void> {
    await teamsApi.updateMember(teamId, userId, { role });
    await loadMembers(teamId, true);
    // Demoting oneself changes what the session may do.
    if (userId === session.user?.id) await session.refresh();
  }

  async function removeMember(teamId: string, userId: string): Promise<void> {
    await teamsApi.removeMember(teamId, userId);
    await loadMembers(teamId, true);
  }

  async function invite(teamId: string, input: CreateInvitationInput): Promise<void> {
    await teamsApi.createInvitation(teamId, input);
    invitations.value = await teamsApi.listInvitations(teamId);
  }

  async function revokeInvitation(teamId: string, invitationId: string): Promise<void> {
    await teamsApi.revokeInvitation(teamId, invitationId);
    invitations.value = await teamsApi.listInvitations(teamId);
  }

  return {
    chosenTeamId,
    currentTeam,
    currentRole,
    members,
    invitations,
    loadingMembers,
    choose,
    loadMembers,
    changeRole,
    removeMember,
    invite,
    revokeInvitation,
  };
});
