import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { siteRoleSchema, teamRoleSchema } from '@shared/schemas/roles';
import { hashPassword } from '../lib/secrets';
import type { Db } from './client';
import { memberships, notes, teams, users } from './tables/index';

/** Every demo account signs in with this password (printed at start-up). */
export const DEMO_PASSWORD = 'thermoledger-demo';

const seedDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../seeds/demo');

const demoTeamsSchema = z.array(z.object({ slug: z.string(), name: z.string(), about: z.string().optional() }));
const demoUsersSchema = z.array(
  z.object({
    email: z.email(),
    displayName: z.string(),
    siteRoles: z.array(siteRoleSchema),
    teams: z.array(z.object({ slug: z.string(), role: teamRoleSchema })),
  }),
);
const demoNotesSchema = z.array(z.object({ team: z.string(), author: z.email(), title: z.string(), body: z.string() }));

export interface DemoSeed {
  teams: z.infer<typeof demoTeamsSchema>;
  users: z.infer<typeof demoUsersSchema>;
  notes: z.infer<typeof demoNotesSchema>;
}

function readJson<T>(file: string, schema: z.ZodType<T>): T {
  const full = path.join(seedDir, file);
  const parsed = schema.safeParse(JSON.parse(readFileSync(full, 'utf8')));
  if (!parsed.success) throw new Error(`Seed file ${full} is not valid: ${parsed.error.message}`);
  return parsed.data;
}

/** Reads and checks seeds/demo/*.json. */
export function loadDemoSeed(): DemoSeed {
  return {
    teams: readJson('teams.json', demoTeamsSchema),
    users: readJson('users.json', demoUsersSchema),
    notes: readJson('notes.json', demoNotesSchema),
  };
}

// argon2 is slow on purpose; tests reseed often, so one hash of the demo password is reused per process.
let demoHash: Promise<string> | undefined;

/**
 * Loads the demo scenario idempotently: users by e-mail and teams by slug are inserted when
 * missing and otherwise left alone, so re-running it changes nothing (not even edited names).
 */
export async function seedDemo(db: Db, seed: DemoSeed = loadDemoSeed()): Promise<void> {
  const existing = new Set((await db.select({ email: users.email }).from(users)).map((u) => u.email));
  const needsHash = seed.users.some((u) => !existing.has(u.email));
  const passwordHash = needsHash ? await (demoHash ??= hashPassword(DEMO_PASSWORD)) : '';

  await db.transaction(async (tx) => {
    for (const team of seed.teams) {
      await tx.insert(teams).values({ slug: team.slug, name: team.name }).onConflictDoNothing({ target: teams.slug });
    }
    const teamIds = new Map(
      (await tx.select({ id: teams.id, slug: teams.slug }).from(teams)).map((t) => [t.slug, t.id]),
    );
    for (const user of seed.users) {
      await tx
        .insert(users)
        .values({ email: user.email, displayName: user.displayName, passwordHash, siteRoles: user.siteRoles })
        .onConflictDoNothing({ target: users.email });
    }
    const userIds = new Map(
      (await tx.select({ id: users.id, email: users.email }).from(users)).map((u) => [u.email, u.id]),
    );
    for (const user of seed.users) {
      for (const m of user.teams) {
        const teamId = teamIds.get(m.slug);
        if (!teamId) throw new Error(`Seed user ${user.email} names unknown team ${m.slug}`);
        await tx
          .insert(memberships)
          .values({ teamId, userId: userIds.get(user.email)!, role: m.role })
          .onConflictDoNothing();
      }
    }
    for (const note of seed.notes) {
      const teamId = teamIds.get(note.team);
      if (!teamId) throw new Error(`Seed note "${note.title}" names unknown team ${note.team}`);
      const [found] = await tx
        .select({ id: notes.id })
        .from(notes)
        .where(and(eq(notes.teamId, teamId), eq(notes.title, note.title)))
        .limit(1);
      if (found) continue;
      const author = seed.users.find((u) => u.email === note.author);
      await tx.insert(notes).values({
        teamId,
        authorId: userIds.get(note.author) ?? null,
        authorName: author?.displayName ?? note.author,
        title: note.title,
        body: note.body,
      });
    }
  });
}
