import { and, desc, eq } from 'drizzle-orm';
import type { Note, NoteInput } from '@shared/schemas/notes';
import type { Db } from '../db/client';
import { notes } from '../db/tables/index';
import { errors } from '../errors';
import type { Principal } from '../context';

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
export async function listNotes(db: Db, teamId: string): Promise<Note[]> {
  const rows = await db.select().from(notes).where(eq(notes.teamId, teamId)).orderBy(desc(notes.updatedAt));
  return rows.map(toNote);
}

export async function createNote(db: Db, author: Principal, teamId: string, input: NoteInput): Promise<Note> {
  const [row] = await db
    .insert(notes)
    .values({
      teamId,
      authorId: author.user.id,
      authorName: author.user.displayName,
      title: input.title,
      body: input.body,
    })
    .returning();
  return toNote(row!);
}

/** Updates a note of this team (another team's note id is simply not found). */
export async function updateNote(db: Db, teamId: string, noteId: string, input: NoteInput): Promise<Note> {
  const [row] = await db
    .update(notes)
    .set({ title: input.title, body: input.body, updatedAt: new Date() })
    .where(and(eq(notes.id, noteId), eq(notes.teamId, teamId)))
    .returning();
  if (!row) throw errors.notFound('The note');
  return toNote(row);
}

export async function deleteNote(db: Db, teamId: string, noteId: string): Promise<void> {
  const [row] = await db
    .delete(notes)
    .where(and(eq(notes.id, noteId), eq(notes.teamId, teamId)))
    .returning({ id: notes.id });
  if (!row) throw errors.notFound('The note');
}
