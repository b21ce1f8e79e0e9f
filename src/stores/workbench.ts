import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { BalanceOptions } from '@/composables/use-equation-input';

/** The workbench's inputs, kept while the user visits other pages. */
export const useWorkbenchStore = defineStore('workbench', () => {
  const text = ref('C3H8 + O2 -> CO2 + H2O');
  const options = ref<BalanceOptions>({ fixed: {}, normaliseTo: null });
  const reversed = ref(false);
  const factor = ref('1');
  const batchText = ref('');

  /** A new equation starts from its own coefficients: earlier choices referred to other terms. */
  function setText(next: string): void {
    if (next === text.value) return;
    text.value = next;
    if (Object.keys(options.value.fixed).length > 0 || options.value.normaliseTo !== null) {
      options.value = { fixed: {}, normaliseTo: null };
    }
  }

  function fix(index: number, value: string | null): void {
    const fixed = { ...options.value.fixed };
    if (value === null || value.trim() === '') delete fixed[String(index)];
    else fixed[String(index)] = value.trim();
    options.value = { ...options.value, fixed };
  }

  function normaliseTo(index: number | null): void {
    options.value = { ...options.value, normaliseTo: index };
  }

  function resetFixed(): void {
    options.value = { ...options.value, fixed: {} };
  }

  function resetTransforms(): void {
    reversed.value = false;
    factor.value = '1';
    options.value = { fixed: {}, normaliseTo: null };
  }

  return { text, options, reversed, factor, batchText, setText, fix, normaliseTo, resetFixed, resetTransforms };
});
