import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { AmendmentCounts, AmendmentDetail, AmendmentInput, AmendmentList } from '@shared/schemas/amendments';
import * as amendmentsApi from '@/api/amendments';
import { useLibraryStore } from './library';
import type { AmendmentActionName, AmendmentFilter } from '@/api/amendments';

/** The review queue, the amendment on screen and the counts the navigation shows. */
export const useAmendmentsStore = defineStore('amendments', () => {
  const list = ref<AmendmentList | null>(null);
  const counts = ref<AmendmentCounts | null>(null);
  const current = ref<AmendmentDetail | null>(null);
  const loading = ref(false);
  let sequence = 0;

  async function loadList(filter: AmendmentFilter): Promise<void> {
    const mine = ++sequence;
    loading.value = true;
    try {
      const reply = await amendmentsApi.listAmendments(filter);
      if (mine === sequence) list.value = reply;
    } finally {
      if (mine === sequence) loading.value = false;
    }
  }

  /** Refreshes the navigation counts; a failure only hides them. */
  async function refreshCounts(): Promise<void> {
    try {
      counts.value = await amendmentsApi.amendmentCounts();
    } catch {
      counts.value = null;
    }
  }

  async function load(id: string): Promise<AmendmentDetail> {
    const detail = await amendmentsApi.getAmendment(id);
    current.value = detail;
    return detail;
  }

  async function create(input: AmendmentInput): Promise<AmendmentDetail> {
    const detail = await amendmentsApi.createAmendment(input);
    void refreshCounts();
    return detail;
  }

  /** Runs an action and reloads the amendment in full (action replies leave the impact out). */
  async function act(id: string, action: AmendmentActionName, reason?: string): Promise<AmendmentDetail> {
    const reply = await amendmentsApi.actOnAmendment(id, action, reason);
    if (action === 'accept') useLibraryStore().forgetCurrent();
    void refreshCounts();
    if (reply.id !== id) return reply; // revert makes a new amendment
    return load(id);
  }

  async function comment(id: string, body: string): Promise<void> {
    await amendmentsApi.addComment(id, body);
    await load(id);
  }

  async function upload(id: string, files: File[]): Promise<void> {
    await amendmentsApi.uploadEvidence(id, files);
    await load(id);
  }

  async function removeFile(id: string, fileId: string): Promise<void> {
    await amendmentsApi.deleteEvidence(id, fileId);
    await load(id);
  }

  return { list, counts, current, loading, loadList, refreshCounts, load, create, act, comment, upload, removeFile };
});
