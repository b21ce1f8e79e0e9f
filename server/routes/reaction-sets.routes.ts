import { z } from 'zod';
import { teamIdParamsSchema } from '@shared/schemas/common';
import {
  copySharedInputSchema,
  createLinkInputSchema,
  createSetInputSchema,
  linkCreatedSchema,
  linkParamsSchema,
  reactionSetSchema,
  revisionChangesSchema,
  SET_LIMITS,
  setDiffQuerySchema,
  setEvaluationSchema,
  setImportInputSchema,
  setListQuerySchema,
  setListSchema,
  setParamsSchema,
  setVersionListSchema,
  setVersionSchema,
  shareLinkListSchema,
  sharedParamsSchema,
  sharedSetSchema,
  updateSetInputSchema,
  versionDiffSchema,
  versionGuardInputSchema,
  versionParamsSchema,
} from '@shared/schemas/reaction-sets';
import { requireActor } from '../context';
import type { AppConfig } from '../env';
import { evaluateSet, revisionChanges } from '../services/reaction-sets-evaluate.service';
import { exportSharedSet, exportTeamSet, type ExportFormat } from '../services/reaction-sets-export.service';
import {
  copySharedSet,
  createLink,
  listLinks,
  openSharedSet,
  revokeLink,
} from '../services/reaction-sets-links.service';
import {
  createSet,
  deleteSet,
  diffVersions,
  getSet,
  getVersion,
  importSet,
  listSets,
  listVersions,
  moveToLatest,
  restoreVersion,
  updateSet,
} from '../services/reaction-sets.service';
import { defineRoute, type AnyRoute } from './registry';

/** The work limits of opening a set anonymously (share links) and of a PDF, with the configured values. */
function setWorkLimits(config: AppConfig): string[] {
  return [
    `at most ${config.calc.requestsPerMinute} requests a minute per address (CALC_RATE_LIMIT_PER_MINUTE), shared with the calculation endpoints`,
    `each opening or PDF weighs the set's items against the ${config.calc.linesPerMinute} equation lines a minute per address (CALC_LINES_PER_MINUTE), as a batch weighs its lines (429 beyond)`,
    `a set holds at most ${SET_LIMITS.items} items, of which at most ${SET_LIMITS.derivations} derivations (each route search has a 2 s budget); a set's results are computed once per version and revision and then served from memory`,
  ];
}

/** A PDF is typeset in the calculation workers, so it is also bounded like a calculation. */
function pdfWorkLimits(config: AppConfig): string[] {
  const { timeBudgetMs, workerHeapMb, queueLimit, limits } = config.calc;
  return [
    ...setWorkLimits(config),
    `the PDF is typeset in the calculation worker threads, off the request thread: past the time budget of ${timeBudgetMs} ms (CALC_TIME_BUDGET_MS) or with ${queueLimit} calculations already waiting (CALC_QUEUE_LIMIT) the reply is 503 with Retry-After; past ${workerHeapMb} MB of worker heap (CALC_WORKER_HEAP_MB) or ${limits.maxReplyBytes} bytes of PDF (CALC_MAX_REPLY_BYTES) it is 413`,
  ];
}

const files: { format: ExportFormat; type: string; words: string }[] = [
  { format: 'csv', type: 'text/csv', words: 'every result as CSV (one row per item; formula-like text neutralised)' },
  { format: 'json', type: 'application/json', words: 'the set and its results as JSON (what import reads)' },
  { format: 'bib', type: 'application/x-bibtex', words: 'BibTeX of every library source the set uses' },
  { format: 'pdf', type: 'application/pdf', words: 'the printable report as PDF' },
];

const teamExports: AnyRoute[] = files.map((f) =>
  defineRoute({
    method: 'get',
    path: `/teams/:teamId/sets/:setId/export.${f.format}`,
    summary: `Export: ${f.words}`,
    tags: ['sets'],
    access: { team: 'viewer' },
    produces: f.type,
    request: { params: setParamsSchema },
    responses: { 200: z.string() },
    ...(f.format === 'pdf' ? { describeLimits: pdfWorkLimits } : {}),
    handler: ({ ctx, params }) => exportTeamSet(ctx, { ...params, format: f.format }),
  }),
);

const sharedExports: AnyRoute[] = files.map((f) =>
  defineRoute({
    method: 'get',
    path: `/shared/:token/export.${f.format}`,
    summary: `Export through a share link: ${f.words}`,
    description: 'The same 404 for a revoked, expired or wrong token. Replies carry Referrer-Policy: no-referrer.',
    tags: ['sets', 'shared'],
    access: 'public',
    rateLimit: 'calc',
    produces: f.type,
    describeLimits: f.format === 'pdf' ? pdfWorkLimits : setWorkLimits,
    request: { params: sharedParamsSchema },
    responses: { 200: z.string() },
    handler: ({ ctx, params }) => exportSharedSet(ctx, { token: params.token, format: f.format }),
  }),
);

/** Reaction sets: viewers read, members write; share links are read-only and need no account. */
export const reactionSetRoutes: AnyRoute[] = [
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets',
    summary: "The team's reaction sets",
    description: 'Searched in title, description and tags (q), filtered by tag, sorted by title, owner or updated.',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema, query: setListQuerySchema },
    responses: { 200: setListSchema },
    handler: ({ ctx, params, query }) => listSets(ctx, { ...query, ...params }),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/sets',
    summary: 'Create a reaction set (version 1)',
    description: `Without "revision" the set is pinned to the newest library revision; "latest" makes it follow the newest. Items without an id get one. At most ${SET_LIMITS.items} items, ${SET_LIMITS.derivations} of them derivations.`,
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: createSetInputSchema },
    responses: { 201: reactionSetSchema },
    handler: ({ ctx, params, body }) => createSet(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/sets/import',
    summary: 'Import a set from its JSON export',
    description:
      'Re-creates the set as exported (title, description, tags, items with their ids, revision) as a new set of this team; the results in the file are not read, they are computed again.',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: setImportInputSchema },
    responses: { 201: reactionSetSchema },
    handler: ({ ctx, params, body }) => importSet(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId',
    summary: 'One reaction set, as stored (its results: …/results)',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: setParamsSchema },
    responses: { 200: reactionSetSchema },
    handler: ({ ctx, params }) => getSet(ctx, params),
  }),
  defineRoute({
    method: 'put',
    path: '/teams/:teamId/sets/:setId',
    summary: 'Save a set (optimistic concurrency)',
    description:
      '"version" is the version the edit started from. When it is no longer current the save is refused with 409 and details {currentVersion, current}; nothing is overwritten. Fields left out keep their values. A save that changes nothing makes no new version.',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: setParamsSchema, body: updateSetInputSchema },
    responses: { 200: reactionSetSchema },
    handler: ({ ctx, params, body }) => updateSet(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/sets/:setId',
    summary: 'Delete a set with its versions and links',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: setParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => deleteSet(requireActor(ctx), params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/results',
    summary: "The set's results at its revision, with sources and cautions",
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: setParamsSchema },
    responses: { 200: setEvaluationSchema },
    handler: ({ ctx, params }) => evaluateSet(ctx, params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/versions',
    summary: 'Every version of the set, newest first: who, when, what changed',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: setParamsSchema },
    responses: { 200: setVersionListSchema },
    handler: ({ ctx, params }) => listVersions(ctx, params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/versions/:version',
    summary: 'One version of the set, whole',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: versionParamsSchema },
    responses: { 200: setVersionSchema },
    handler: ({ ctx, params }) => getVersion(ctx, params),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/diff',
    summary: 'What changed between two versions (fields, and items by id)',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: setParamsSchema, query: setDiffQuerySchema },
    responses: { 200: versionDiffSchema },
    handler: ({ ctx, params, query }) => diffVersions(ctx, { ...params, ...query }),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/sets/:setId/versions/:version/restore',
    summary: 'Restore an earlier version (as a new version)',
    description: 'The body names the current version the caller saw ({"version"}); a stale one → 409 as for PUT.',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: versionParamsSchema, body: versionGuardInputSchema },
    responses: { 200: reactionSetSchema },
    handler: ({ ctx, params, body }) =>
      restoreVersion(requireActor(ctx), {
        teamId: params.teamId,
        setId: params.setId,
        restore: params.version,
        version: body.version,
      }),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/revision-changes',
    summary: 'What moving a pinned set to the newest library revision would change (old → new ΔH per item)',
    tags: ['sets'],
    access: { team: 'viewer' },
    request: { params: setParamsSchema },
    responses: { 200: revisionChangesSchema },
    handler: ({ ctx, params }) => revisionChanges(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/sets/:setId/move-to-latest',
    summary: 'Pin the set to the newest library revision (a new version)',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: setParamsSchema, body: versionGuardInputSchema },
    responses: { 200: reactionSetSchema },
    handler: ({ ctx, params, body }) => moveToLatest(requireActor(ctx), { ...params, ...body }),
  }),
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/sets/:setId/links',
    summary: "The set's share links: created, expiry, last use, state (never the token)",
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: setParamsSchema },
    responses: { 200: shareLinkListSchema },
    handler: ({ ctx, params }) => listLinks(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/sets/:setId/links',
    summary: 'Create a read-only share link (the token is shown once)',
    description:
      'The token has 256 random bits in its verifier and is stored only as a hash: a lost link is replaced by a new one. With "email" the link is also sent; if that fails, no link is made (503).',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: setParamsSchema, body: createLinkInputSchema },
    responses: { 201: linkCreatedSchema },
    handler: ({ ctx, params, body }) => createLink(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/sets/:setId/links/:linkId',
    summary: 'Revoke a share link',
    tags: ['sets'],
    access: { team: 'member' },
    request: { params: linkParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => revokeLink(requireActor(ctx), params),
  }),
  ...teamExports,
  defineRoute({
    method: 'get',
    path: '/shared/:token',
    summary: 'A set opened by its share link: results at its revision, every source and caution',
    description:
      'No account needed. Shows the one set and nothing else (no team, no members, no ids). Revoked, expired or wrong → the same 404. Replies carry Referrer-Policy: no-referrer and X-Robots-Tag: noindex.',
    tags: ['sets', 'shared'],
    access: 'public',
    rateLimit: 'calc',
    describeLimits: setWorkLimits,
    request: { params: sharedParamsSchema },
    responses: { 200: sharedSetSchema },
    handler: ({ ctx, params }) => openSharedSet(ctx, params),
  }),
  ...sharedExports,
  defineRoute({
    method: 'post',
    path: '/shared/:token/copy',
    summary: 'Copy a shared set into one of your teams',
    description:
      'Signed-in callers only, into a team where they are a member or above; the copy is pinned to the revision the link shows.',
    tags: ['sets', 'shared'],
    access: 'signed_in',
    request: { params: sharedParamsSchema, body: copySharedInputSchema },
    responses: { 201: reactionSetSchema },
    handler: ({ ctx, params, body }) => copySharedSet(requireActor(ctx), { token: params.token, teamId: body.teamId }),
  }),
];
