import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { Note, NoteInput } from '@shared/schemas/notes';
import * as notesApi from '@/api/notes';

/** The notes of the team on screen. */
export const useNotesStore = defineStore('notes', () => {
  const notes = ref<Note[]>([]);
  const teamId = ref<string | null>(null);
  const loading = ref(false);

  async function load(forTeam: string): Promise<void> {
    loading.value = true;
    try {
      if (teamId.value !== forTeam) notes.value = [];
      teamId.value = forTeam;
      notes.value = await notesApi.listNotes(forTeam);
    } finally {
      loading.value = false;
    }
  }

  async function create(forTeam: string, input: NoteInput): Promise<Note> {
    const note = await notesApi.createNote(forTeam, input);
    notes.value = [note, ...notes.value.filter((n) => n.id !== note.id)];
    return note;
  }

  async function update(forTeam: string, noteId: string, input: NoteInput): Promise<void> {
    const note = await notesApi.updateNote(forTeam, noteId, input);
    notes.value = notes.value.map((n) => (n.id === noteId ? note : n));
  }

  async function remove(forTeam: string, noteId: string): Promise<void> {
    await notesApi.deleteNote(forTeam, noteId);
    notes.value = notes.value.filter((n) => n.id !== noteId);
  }

  return { notes, teamId, loading, load, create, update, remove };
});
