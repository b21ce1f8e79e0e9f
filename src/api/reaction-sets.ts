import {
  linkCreatedSchema,
  reactionSetSchema,
  revisionChangesSchema,
  setConflictDetailsSchema,
  setEvaluationSchema,
  setListSchema,
  setVersionListSchema,
  setVersionSchema,
  shareLinkListSchema,
  sharedSetSchema,
  versionDiffSchema,
  type CreateLinkInput,
  type CreateSetInput,
  type LinkCreated,
  type ReactionSet,
  type RevisionChanges,
  type SetEvaluation,
  type SetList,
  type SetListQuery,
  type SetVersion,
  type ShareLink,
  type SharedSet,
  type UpdateSetInput,
} from '@shared/schemas/reaction-sets';
import type { z } from 'zod';
import { ApiError } from './api-error';
import { API_BASE, http } from './http';

const setsPath = (teamId: string) => `/teams/${encodeURIComponent(teamId)}/sets`;
const setPath = (teamId: string, setId: string) => `${setsPath(teamId)}/${encodeURIComponent(setId)}`;
const sharedPath = (token: string) => `/shared/${encodeURIComponent(token)}`;

/** A team's sets (viewers may read): searched, filtered by tag, sorted. */
export function listSets(teamId: string, query: Partial<SetListQuery> = {}): Promise<SetList> {
  return http.get(setsPath(teamId), { schema: setListSchema, query });
}

/** Creates a set (version 1); members and above. */
export function createSet(teamId: string, input: CreateSetInput): Promise<ReactionSet> {
  return http.post(setsPath(teamId), input, { schema: reactionSetSchema });
}

export function getSet(teamId: string, setId: string): Promise<ReactionSet> {
  return http.get(setPath(teamId, setId), { schema: reactionSetSchema });
}

/** The set as someone else saved it, when a save was refused as stale (409). */
export type SetConflict = z.infer<typeof setConflictDetailsSchema>;

/** Reads the 409 of a stale save; null for any other failure. */
export function conflictOf(error: unknown): SetConflict | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const parsed = setConflictDetailsSchema.safeParse(error.details);
  return parsed.success ? parsed.data : null;
}

/** Saves an edit made on `input.version`; a stale version rejects with a 409 ({@link conflictOf}). */
export function updateSet(teamId: string, setId: string, input: UpdateSetInput): Promise<ReactionSet> {
  return http.put(setPath(teamId, setId), input, { schema: reactionSetSchema });
}

export function deleteSet(teamId: string, setId: string): Promise<void> {
  return http.delete(setPath(teamId, setId));
}

export function getSetResults(teamId: string, setId: string): Promise<SetEvaluation> {
  return http.get(`${setPath(teamId, setId)}/results`, { schema: setEvaluationSchema });
}

export async function listSetVersions(teamId: string, setId: string) {
  return http.get(`${setPath(teamId, setId)}/versions`, { schema: setVersionListSchema });
}

export function getSetVersion(teamId: string, setId: string, version: number): Promise<SetVersion> {
  return http.get(`${setPath(teamId, setId)}/versions/${version}`, { schema: setVersionSchema });
}

export function diffSetVersions(teamId: string, setId: string, from: number, to: number) {
  return http.get(`${setPath(teamId, setId)}/diff`, { schema: versionDiffSchema, query: { from, to } });
}

/** Restores `restore` as a new version; `version` is the current one the caller saw. */
export function restoreSetVersion(teamId: string, setId: string, restore: number, version: number) {
  return http.post(`${setPath(teamId, setId)}/versions/${restore}/restore`, { version }, { schema: reactionSetSchema });
}

export function getRevisionChanges(teamId: string, setId: string): Promise<RevisionChanges> {
  return http.get(`${setPath(teamId, setId)}/revision-changes`, { schema: revisionChangesSchema });
}

export function moveSetToLatest(teamId: string, setId: string, version: number): Promise<ReactionSet> {
  return http.post(`${setPath(teamId, setId)}/move-to-latest`, { version }, { schema: reactionSetSchema });
}

export async function listShareLinks(teamId: string, setId: string): Promise<ShareLink[]> {
  return (await http.get(`${setPath(teamId, setId)}/links`, { schema: shareLinkListSchema })).items;
}

/** Creates a read-only link; the token in the reply is shown once and never again. */
export function createShareLink(teamId: string, setId: string, input: CreateLinkInput): Promise<LinkCreated> {
  return http.post(`${setPath(teamId, setId)}/links`, input, { schema: linkCreatedSchema });
}

export function revokeShareLink(teamId: string, setId: string, linkId: string): Promise<void> {
  return http.delete(`${setPath(teamId, setId)}/links/${encodeURIComponent(linkId)}`);
}

/** A set opened by its share link (no sign-in). */
export function openSharedSet(token: string): Promise<SharedSet> {
  return http.get(sharedPath(token), { schema: sharedSetSchema });
}

/** Copies a shared set into one of the caller's teams. */
export function copySharedSet(token: string, teamId: string): Promise<ReactionSet> {
  return http.post(`${sharedPath(token)}/copy`, { teamId }, { schema: reactionSetSchema });
}

export type ExportFormat = 'csv' | 'json' | 'bib' | 'pdf';

/** Where a file export downloads from (a plain link: the browser saves it under the server's name). */
export function setExportUrl(teamId: string, setId: string, format: ExportFormat): string {
  return `${API_BASE}${setPath(teamId, setId)}/export.${format}`;
}

export function sharedExportUrl(token: string, format: ExportFormat): string {
  return `${API_BASE}${sharedPath(token)}/export.${format}`;
}
