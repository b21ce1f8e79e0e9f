import { teamIdParamsSchema } from '@shared/schemas/common';
import { noteInputSchema, noteListSchema, noteParamsSchema, noteSchema } from '@shared/schemas/notes';
import { createNote, deleteNote, listNotes, updateNote } from '../services/notes.service';
import { defineRoute, signedIn } from './registry';

/** Team notes: viewers read, members write. */
export const noteRoutes = [
  defineRoute({
    method: 'get',
    path: '/teams/:teamId/notes',
    summary: "The team's notes",
    tags: ['notes'],
    access: { team: 'viewer' },
    request: { params: teamIdParamsSchema },
    responses: { 200: noteListSchema },
    handler: async ({ deps, params }) => ({ notes: await listNotes(deps.db, params.teamId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/notes',
    summary: 'Add a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: noteInputSchema },
    responses: { 201: noteSchema },
    handler: (ctx) => createNote(ctx.deps.db, signedIn(ctx), ctx.params.teamId, ctx.body),
  }),
  defineRoute({
    method: 'patch',
    path: '/teams/:teamId/notes/:noteId',
    summary: 'Edit a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: noteParamsSchema, body: noteInputSchema },
    responses: { 200: noteSchema },
    handler: ({ deps, params, body }) => updateNote(deps.db, params.teamId, params.noteId, body),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/notes/:noteId',
    summary: 'Delete a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: noteParamsSchema },
    responses: { 204: null },
    handler: ({ deps, params }) => deleteNote(deps.db, params.teamId, params.noteId),
  }),
];
