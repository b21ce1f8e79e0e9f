import { defineStore } from 'pinia';
import { ref, shallowRef } from 'vue';
import type { DeriveInput, DeriveResult } from '@shared/schemas/derive';
import * as deriveApi from '@/api/derive';
import { defaultDeriveState, type DeriveFormState } from '@/lib/derive-query';
import { isBlankRow } from '@/lib/given-reactions';

/**
 * The derive page: its inputs (kept while the user visits other pages) and the last result with
 * the request that produced it, so the result always describes what was sent, even after the
 * inputs change. A late reply to an older request is dropped.
 */
export const useDeriveStore = defineStore('derive', () => {
  const form = ref<DeriveFormState>(defaultDeriveState());
  const result = shallowRef<DeriveResult | null>(null);
  const request = shallowRef<DeriveInput | null>(null);
  const loading = ref(false);

  let controller: AbortController | null = null;
  let sequence = 0;

  /** Drops rows nothing was typed into, so the rows and the request's `reactions` keep the same numbers. */
  function pruneBlankRows(): void {
    const kept = form.value.reactions.filter((r) => !isBlankRow(r));
    if (kept.length !== form.value.reactions.length) form.value = { ...form.value, reactions: kept };
  }

  /** Sends a checked request; rejects with the ApiError (the caller shows it). */
  async function run(input: DeriveInput): Promise<DeriveResult | null> {
    const mine = ++sequence;
    controller?.abort();
    controller = new AbortController();
    loading.value = true;
    try {
      const reply = await deriveApi.deriveEnthalpy(input, controller.signal);
      if (mine !== sequence) return null;
      result.value = reply;
      request.value = input;
      return reply;
    } catch (error) {
      if (mine === sequence) {
        result.value = null;
        request.value = null;
      }
      throw error;
    } finally {
      if (mine === sequence) loading.value = false;
    }
  }

  function clearResult(): void {
    sequence++;
    controller?.abort();
    loading.value = false;
    result.value = null;
    request.value = null;
  }

  return { form, result, request, loading, pruneBlankRows, run, clearResult };
});
