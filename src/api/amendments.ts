import {
  amendmentCountsSchema,
  amendmentDetailSchema,
  amendmentListSchema,
  evidenceFileListSchema,
  type AmendmentCounts,
  type AmendmentDetail,
  type AmendmentInput,
  type AmendmentList,
  type AmendmentState,
  type EvidenceFile,
} from '@shared/schemas/amendments';
import { amendmentCommentSchema, type AmendmentComment } from '@shared/schemas/amendments';
import {
  notificationSettingsSchema,
  type NotificationSettings,
  type NotificationSettingsInput,
} from '@shared/schemas/notifications';
import { importJobSchema, importLimitsSchema, type ImportJob, type ImportLimits } from '@shared/schemas/library-io';
import { API_BASE, http } from './http';

const base = '/amendments';
const one = (id: string) => `${base}/${encodeURIComponent(id)}`;

/** Filters of the review queue (GET /amendments). */
export interface AmendmentFilter {
  state?: AmendmentState[];
  author?: 'me';
  species?: string;
  olderThanDays?: number;
  sort?: 'newest' | 'oldest' | 'updated' | 'title';
  limit?: number;
  offset?: number;
}

/** The queue: amendments the caller may see, filtered and sorted by the server. */
export function listAmendments(filter: AmendmentFilter, signal?: AbortSignal): Promise<AmendmentList> {
  return http.get(base, {
    schema: amendmentListSchema,
    signal,
    query: {
      state: filter.state && filter.state.length > 0 ? filter.state.join(',') : undefined,
      author: filter.author,
      species: filter.species || undefined,
      olderThanDays: filter.olderThanDays,
      sort: filter.sort,
      limit: filter.limit,
      offset: filter.offset,
    },
  });
}

/** Counts for the navigation (open ones awaiting the curator, the caller's own needing action). */
export function amendmentCounts(): Promise<AmendmentCounts> {
  return http.get(`${base}/counts`, { schema: amendmentCountsSchema });
}

/** One amendment with its diff, impact, comments, files, history and what the caller may do. */
export function getAmendment(id: string, signal?: AbortSignal): Promise<AmendmentDetail> {
  return http.get(one(id), { schema: amendmentDetailSchema, signal });
}

/** Creates a draft. */
export function createAmendment(input: AmendmentInput): Promise<AmendmentDetail> {
  return http.post(base, input, { schema: amendmentDetailSchema });
}

/** Rewrites a draft or returned amendment. */
export function updateAmendment(id: string, input: AmendmentInput): Promise<AmendmentDetail> {
  return http.put(one(id), input, { schema: amendmentDetailSchema });
}

/** The state-changing actions; return and decline carry a reason. */
export type AmendmentActionName = 'open' | 'withdraw' | 'accept' | 'return' | 'decline' | 'rebase' | 'revert';

export function actOnAmendment(id: string, action: AmendmentActionName, reason?: string): Promise<AmendmentDetail> {
  const body = action === 'return' || action === 'decline' ? { reason } : undefined;
  return http.post(`${one(id)}/${action}`, body, { schema: amendmentDetailSchema });
}

/** Adds a comment. */
export function addComment(id: string, body: string): Promise<AmendmentComment> {
  return http.post(`${one(id)}/comments`, { body }, { schema: amendmentCommentSchema });
}

/** Uploads evidence files (multipart field `files`). */
export async function uploadEvidence(id: string, files: File[]): Promise<EvidenceFile[]> {
  const form = new FormData();
  for (const f of files) form.append('files', f, f.name);
  return (await http.post(`${one(id)}/files`, form, { schema: evidenceFileListSchema })).items;
}

/** Removes an evidence file. */
export function deleteEvidence(id: string, fileId: string): Promise<void> {
  return http.delete(`${one(id)}/files/${encodeURIComponent(fileId)}`);
}

/** The download link of a file (sent as an attachment by the server). */
export function evidenceHref(file: EvidenceFile): string {
  return file.href.startsWith('/api/') ? file.href : `${API_BASE}${file.href}`;
}

/** The caller's e-mail settings per message kind. */
export function getNotificationSettings(): Promise<NotificationSettings> {
  return http.get('/account/notifications', { schema: notificationSettingsSchema });
}

export function updateNotificationSettings(input: NotificationSettingsInput): Promise<NotificationSettings> {
  return http.patch('/account/notifications', input, { schema: notificationSettingsSchema });
}

// ——— Bulk import ———

/** What an import takes (file size, count, rows) and each table's columns, from the server's settings. */
export function importLimits(signal?: AbortSignal): Promise<ImportLimits> {
  return http.get(`${base}/imports/limits`, { schema: importLimitsSchema, ...(signal ? { signal } : {}) });
}

/** Starts an import of library tables (multipart field `files`); answers 202 with the job to poll. */
export function startImport(input: { files: File[]; title?: string; rationale?: string }): Promise<ImportJob> {
  const form = new FormData();
  if (input.title) form.append('title', input.title);
  if (input.rationale) form.append('rationale', input.rationale);
  for (const f of input.files) form.append('files', f, f.name);
  return http.post(`${base}/imports`, form, { schema: importJobSchema });
}

/** An import job's progress and outcome (only for the user who started it). */
export function getImportJob(jobId: string, signal?: AbortSignal): Promise<ImportJob> {
  return http.get(`${base}/imports/${encodeURIComponent(jobId)}`, {
    schema: importJobSchema,
    ...(signal ? { signal } : {}),
  });
}

/** Where the library's values download as CSV (the import's values table), at a revision or the newest. */
export function libraryExportHref(format: 'csv' | 'json', revision?: number | null): string {
  const query = revision ? `?revision=${revision}` : '';
  return `${API_BASE}/library/export.${format}${query}`;
}
