import { and, desc, eq } from 'drizzle-orm';
import type { Note, NoteInput } from '@shared/schemas/notes';
import type { ActorContext, ServiceContext } from '../context';
import { notes } from '../db/tables/index';
import { errors } from '../errors';

type NoteRow = typeof notes.$inferSelect;

function toNote(row: NoteRow): Note {
  return {
    id: row.id,
    teamId: row.teamId,
    title: row.title,
    body: row.body,
    authorName: row.authorName,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A team's notes, most recently changed first. */
export async function listNotes(ctx: ServiceContext, input: { teamId: string }): Promise<{ notes: Note[] }> {
  const rows = await ctx.db.select().from(notes).where(eq(notes.teamId, input.teamId)).orderBy(desc(notes.updatedAt));
  return { notes: rows.map(toNote) };
}

export async function createNote(ctx: ActorContext, input: NoteInput & { teamId: string }): Promise<Note> {
  const [row] = await ctx.db
    .insert(notes)
    .values({
      teamId: input.teamId,
      authorId: ctx.actor.user.id,
      authorName: ctx.actor.user.displayName,
      title: input.title,
      body: input.body,
    })
    .returning();
  return toNote(row!);
}

/** Updates a note of this team (another team's note id is simply not found). */
export async function updateNote(
  ctx: ActorContext,
  input: NoteInput & { teamId: string; noteId: string },
): Promise<Note> {
  const [row] = await ctx.db
    .update(notes)
    .set({ title: input.title, body: input.body, updatedAt: new Date() })
    .where(and(eq(notes.id, input.noteId), eq(notes.teamId, input.teamId)))
    .returning();
  if (!row) throw errors.notFound('The note');
  return toNote(row);
}

export async function deleteNote(ctx: ActorContext, input: { teamId: string; noteId: string }): Promise<void> {
  const [row] = await ctx.db
    .delete(notes)
    .where(and(eq(notes.id, input.noteId), eq(notes.teamId, input.teamId)))
    .returning({ id: notes.id });
  if (!row) throw errors.notFound('The note');
}
