import { computed } from 'vue';
import { useRoute } from 'vue-router';
import { teamRoleAtLeast, type TeamRole } from '@shared/schemas/roles';
import { useSessionStore } from '@/stores/session';

/** The team named by the route's :teamId, and what the caller's role there allows. */
export function useTeamRoute() {
  const route = useRoute();
  const session = useSessionStore();
  const teamId = computed(() => String(route.params.teamId ?? ''));
  const membership = computed(() => session.teams.find((t) => t.id === teamId.value) ?? null);
  const role = computed<TeamRole | null>(() => membership.value?.role ?? null);
  const can = (required: TeamRole) => computed(() => role.value !== null && teamRoleAtLeast(role.value, required));
  return { teamId, membership, role, canWrite: can('member'), canAdminister: can('team_admin') };
}
