import { z } from 'zod';
import { idSchema, isoDateTimeSchema } from './common';
import { plainText } from './text';

/** A team note: free text the team keeps beside its work (plans, batch remarks). */
export const noteSchema = z.object({
  id: idSchema,
  teamId: idSchema,
  title: z.string(),
  body: z.string(),
  authorName: z.string(),
  createdAt: isoDateTimeSchema,
  updatedAt: isoDateTimeSchema,
});
export type Note = z.infer<typeof noteSchema>;

export const noteListSchema = z.object({ notes: z.array(noteSchema) });

export const noteInputSchema = z.object({
  title: plainText().trim().min(1, 'Give the note a title.').max(200),
  body: plainText().max(20_000),
});
export type NoteInput = z.infer<typeof noteInputSchema>;

export const noteParamsSchema = z.object({ teamId: idSchema, noteId: idSchema });
