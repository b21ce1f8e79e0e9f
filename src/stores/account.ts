import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { ApiToken, ChangePasswordInput, CreateApiTokenInput, CreatedApiToken } from '@shared/schemas/account';
import * as accountApi from '@/api/account';
import { useSessionStore } from './session';

/** The signed-in person's own settings: name, password, API tokens. */
export const useAccountStore = defineStore('account', () => {
  const tokens = ref<ApiToken[]>([]);
  const loadingTokens = ref(false);

  async function loadTokens(): Promise<void> {
    loadingTokens.value = true;
    try {
      tokens.value = await accountApi.listApiTokens();
    } finally {
      loadingTokens.value = false;
    }
  }

  async function rename(displayName: string): Promise<void> {
    useSessionStore().adopt(await accountApi.updateAccount({ displayName }));
  }

  function changePassword(input: ChangePasswordInput): Promise<void> {
    return accountApi.changePassword(input);
  }

  async function createToken(input: CreateApiTokenInput): Promise<CreatedApiToken> {
    const created = await accountApi.createApiToken(input);
    await loadTokens();
    return created;
  }

  async function revokeToken(tokenId: string): Promise<void> {
    await accountApi.revokeApiToken(tokenId);
    tokens.value = tokens.value.filter((t) => t.id !== tokenId);
  }

  return { tokens, loadingTokens, loadTokens, rename, changePassword, createToken, revokeToken };
});
