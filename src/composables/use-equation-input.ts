import { computed, onScopeDispose, ref, shallowRef, watch, type Ref } from 'vue';
import {
  balanceEquation as balanceHere,
  ChemistryError,
  toBalanceReply,
  type ParsedEquation,
} from '@shared/chemistry/index';
import type { BalanceInput } from '@shared/schemas/balance';
import { balanceEquation } from '@/api/balance';
import { isApiError } from '@/api/api-error';
import { apiErrorText, fieldErrors } from '@/lib/api-error-words';
import { readEquation, type ParseProblem } from '@/lib/read-equation';
import type { BalanceOutcome } from '@/lib/workbench-view';

/** Options sent with each balance request besides the text. */
export interface BalanceOptions {
  fixed: Record<string, string>;
  normaliseTo: number | null;
}

/**
 * The equation field's logic: the text is parsed in the browser on every keystroke (so the
 * faulty spot is marked at once) and, once readable, balanced by the server after a short pause.
 * When the server cannot be reached the same core balances the browser's reading instead. Each
 * reply is kept with the reading it answers (`outcome`), so the two always describe the same terms.
 */
export function useEquationInput(text: Ref<string>, options: Ref<BalanceOptions>, delayMs = 300) {
  const reading = computed(() => readEquation(text.value));
  const parsed = computed(() => (reading.value.kind === 'ok' ? reading.value.parsed : null));
  const problem = computed<ParseProblem | null>(() => (reading.value.kind === 'error' ? reading.value.problem : null));

  const outcome = shallowRef<BalanceOutcome | null>(null);
  /** The reply alone (null while there is none). */
  const result = computed(() => outcome.value?.reply ?? null);
  /** A request the server refused for its options (fixed coefficients, normalise index). */
  const requestError = ref<string | null>(null);
  const optionErrors = ref<Record<string, string>>({});
  const balancing = ref(false);
  /** True when the shown result was computed in the browser because the server was unreachable. */
  const computedLocally = ref(false);

  let timer: ReturnType<typeof setTimeout> | undefined;
  let controller: AbortController | null = null;
  let sequence = 0;

  function requestBody(): BalanceInput {
    const body: BalanceInput = { equation: text.value };
    if (Object.keys(options.value.fixed).length > 0) body.fixed = { ...options.value.fixed };
    if (options.value.normaliseTo !== null) body.normaliseTo = options.value.normaliseTo;
    return body;
  }

  function balanceLocally(reading: ParsedEquation, body: BalanceInput): void {
    try {
      const options = {
        ...(body.fixed ? { fixed: body.fixed } : {}),
        ...(body.normaliseTo === undefined ? {} : { normaliseTo: body.normaliseTo }),
      };
      outcome.value = { reading, reply: toBalanceReply(balanceHere(reading, options)) };
      computedLocally.value = true;
    } catch (error) {
      outcome.value = null;
      requestError.value = error instanceof ChemistryError ? error.message : 'The equation could not be balanced.';
    }
  }

  async function balanceNow(): Promise<void> {
    const reading = parsed.value;
    if (reading === null) return;
    const mine = ++sequence;
    controller?.abort();
    controller = new AbortController();
    const body = requestBody();
    balancing.value = true;
    try {
      const reply = await balanceEquation(body, controller.signal);
      if (mine !== sequence) return;
      outcome.value = { reading, reply };
      requestError.value = null;
      optionErrors.value = {};
      computedLocally.value = false;
    } catch (error) {
      if (mine !== sequence) return;
      if (isApiError(error) && error.details.aborted === true) return;
      if (
        isApiError(error) &&
        (error.code === 'network_error' ||
          error.code === 'unexpected_reply' ||
          error.code === 'unavailable' ||
          error.code === 'rate_limited')
      ) {
        requestError.value = null;
        optionErrors.value = {};
        balanceLocally(reading, body);
      } else {
        outcome.value = null;
        requestError.value = apiErrorText(error);
        optionErrors.value = fieldErrors(error);
      }
    } finally {
      if (mine === sequence) balancing.value = false;
    }
  }

  watch(
    [text, options],
    () => {
      clearTimeout(timer);
      if (reading.value.kind !== 'ok') {
        // Nothing readable: drop the old answer so it cannot be mistaken for this text's.
        sequence++;
        controller?.abort();
        outcome.value = null;
        requestError.value = null;
        optionErrors.value = {};
        balancing.value = false;
        return;
      }
      balancing.value = true;
      timer = setTimeout(() => void balanceNow(), delayMs);
    },
    { immediate: true, deep: true },
  );

  // Runs when the owning component (or effect scope) goes away.
  onScopeDispose(() => {
    clearTimeout(timer);
    controller?.abort();
  });

  return {
    reading,
    parsed,
    problem,
    outcome,
    result,
    requestError,
    optionErrors,
    balancing,
    computedLocally,
    balanceNow,
  };
}
