import { noteListSchema, noteSchema, type Note, type NoteInput } from '@shared/schemas/notes';
import { http } from './http';

const notesPath = (teamId: string) => `/teams/${encodeURIComponent(teamId)}/notes`;

/** A team's notes (viewers may read). */
export async function listNotes(teamId: string): Promise<Note[]> {
  return (await http.get(notesPath(teamId), { schema: noteListSchema })).notes;
}

/** Adds a note (members and team admins). */
export function createNote(teamId: string, input: NoteInput): Promise<Note> {
  return http.post(notesPath(teamId), input, { schema: noteSchema });
}

/** Rewrites a note's title and body. */
export function updateNote(teamId: string, noteId: string, input: NoteInput): Promise<Note> {
  return http.patch(`${notesPath(teamId)}/${encodeURIComponent(noteId)}`, input, { schema: noteSchema });
}

/** Deletes a note. */
export function deleteNote(teamId: string, noteId: string): Promise<void> {
  return http.delete(`${notesPath(teamId)}/${encodeURIComponent(noteId)}`);
}
