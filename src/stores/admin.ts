import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { AdminTeam, AdminUser, AuditEvent, CreateTeamInput, UpdateUserInput } from '@shared/schemas/admin';
import * as adminApi from '@/api/admin';
import type { Outbox } from '@/api/admin';

/** Site administration: users, teams, the development outbox and the audit log. */
export const useAdminStore = defineStore('admin', () => {
  const users = ref<AdminUser[]>([]);
  const teams = ref<AdminTeam[]>([]);
  const outbox = ref<Outbox | null>(null);
  const events = ref<AuditEvent[]>([]);
  const loading = ref(false);

  async function withLoading<T>(work: () => Promise<T>): Promise<T> {
    loading.value = true;
    try {
      return await work();
    } finally {
      loading.value = false;
    }
  }

  const loadUsers = () => withLoading(async () => void (users.value = await adminApi.listUsers()));
  const loadTeams = () => withLoading(async () => void (teams.value = await adminApi.listTeams()));
  const loadOutbox = () => withLoading(async () => void (outbox.value = await adminApi.getOutbox()));
  const loadEvents = (before?: string) =>
    withLoading(async () => {
      const page = await adminApi.listAuditEvents({ limit: 100, before });
      events.value = before ? [...events.value, ...page] : page;
      return page.length;
    });

  async function updateUser(userId: string, input: UpdateUserInput): Promise<void> {
    const updated = await adminApi.updateUser(userId, input);
    users.value = users.value.map((u) => (u.id === userId ? updated : u));
  }

  async function createTeam(input: CreateTeamInput): Promise<void> {
    await adminApi.createTeam(input);
    teams.value = await adminApi.listTeams();
  }

  return {
    users,
    teams,
    outbox,
    events,
    loading,
    loadUsers,
    loadTeams,
    loadOutbox,
    loadEvents,
    updateUser,
    createTeam,
  };
});
