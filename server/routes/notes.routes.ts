import { teamIdParamsSchema } from '@shared/schemas/common';
import { noteInputSchema, noteListSchema, noteParamsSchema, noteSchema } from '@shared/schemas/notes';
import { requireActor } from '../context';
import { createNote, deleteNote, listNotes, updateNote } from '../services/notes.service';
import { defineRoute } from './registry';

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
    handler: ({ ctx, params }) => listNotes(ctx, params),
  }),
  defineRoute({
    method: 'post',
    path: '/teams/:teamId/notes',
    summary: 'Add a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: teamIdParamsSchema, body: noteInputSchema },
    responses: { 201: noteSchema },
    handler: ({ ctx, params, body }) => createNote(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'patch',
    path: '/teams/:teamId/notes/:noteId',
    summary: 'Edit a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: noteParamsSchema, body: noteInputSchema },
    responses: { 200: noteSchema },
    handler: ({ ctx, params, body }) => updateNote(requireActor(ctx), { ...body, ...params }),
  }),
  defineRoute({
    method: 'delete',
    path: '/teams/:teamId/notes/:noteId',
    summary: 'Delete a note',
    tags: ['notes'],
    access: { team: 'member' },
    request: { params: noteParamsSchema },
    responses: { 204: null },
    handler: ({ ctx, params }) => deleteNote(requireActor(ctx), params),
  }),
];
