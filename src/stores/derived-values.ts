import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { DerivedValue, DerivedValueInput } from '@shared/schemas/derived-values';
import * as valuesApi from '@/api/derived-values';

/** The derived ΔfH° values of the team on screen. */
export const useDerivedValuesStore = defineStore('derived-values', () => {
  const values = ref<DerivedValue[]>([]);
  const teamId = ref<string | null>(null);
  const loading = ref(false);

  async function load(forTeam: string): Promise<void> {
    loading.value = true;
    try {
      if (teamId.value !== forTeam) values.value = [];
      teamId.value = forTeam;
      values.value = await valuesApi.listDerivedValues(forTeam);
    } finally {
      loading.value = false;
    }
  }

  async function save(forTeam: string, input: DerivedValueInput): Promise<DerivedValue> {
    const saved = await valuesApi.saveDerivedValue(forTeam, input);
    if (teamId.value === forTeam) values.value = [saved, ...values.value.filter((v) => v.id !== saved.id)];
    return saved;
  }

  async function remove(forTeam: string, valueId: string): Promise<void> {
    await valuesApi.deleteDerivedValue(forTeam, valueId);
    if (teamId.value === forTeam) values.value = values.value.filter((v) => v.id !== valueId);
  }

  return { values, teamId, loading, load, save, remove };
});
