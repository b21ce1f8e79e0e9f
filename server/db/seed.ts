import { and, eq, inArray } from 'drizzle-orm';
import { loadDemoSeed, PUBLISHED_DEMO_PASSWORD, type DemoSeed } from '../../seeds/demo/demo-seed';
import { hashPassword, verifyPassword } from '../lib/secrets';
import type { Db } from './client';
import { memberships, notes, teams, users } from './tables/index';

// argon2 is slow on purpose; tests reseed often, so one hash per password is reused per process.
const hashes = new Map<string, Promise<string>>();

/**
 * Loads the demo scenario idempotently: users by e-mail and teams by slug are inserted when
 * missing and otherwise left alone, so re-running it changes nothing (not even edited names or
 * passwords). New demo accounts get `password` (default: the published demo password).
 */
export async function seedDemo(
  db: Db,
  options: { password?: string; seed?: DemoSeed } = {},
): Promise<{ created: number }> {
  const seed = options.seed ?? loadDemoSeed();
  const password = options.password ?? PUBLISHED_DEMO_PASSWORD;
  const existing = new Set((await db.select({ email: users.email }).from(users)).map((u) => u.email));
  const missing = seed.users.filter((u) => !existing.has(u.email));
  if (missing.length > 0 && !hashes.has(password)) hashes.set(password, hashPassword(password));
  const passwordHash = missing.length > 0 ? await hashes.get(password)! : '';

  await db.transaction(async (tx) => {
    for (const team of seed.teams) {
      await tx.insert(teams).values({ slug: team.slug, name: team.name }).onConflictDoNothing({ target: teams.slug });
    }
    const teamIds = new Map(
      (await tx.select({ id: teams.id, slug: teams.slug }).from(teams)).map((t) => [t.slug, t.id]),
    );
    for (const user of missing) {
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
  return { created: missing.length };
}

/** E-mails of enabled demo accounts that still sign in with the published demo password. */
export async function demoAccountsWithPublishedPassword(db: Db, seed: DemoSeed = loadDemoSeed()): Promise<string[]> {
  const rows = await db
    .select({ email: users.email, passwordHash: users.passwordHash, disabled: users.disabled })
    .from(users)
    .where(
      inArray(
        users.email,
        seed.users.map((u) => u.email),
      ),
    );
  const checked = await Promise.all(
    rows
      .filter((row) => !row.disabled)
      .map(async (row) => ((await verifyPassword(row.passwordHash, PUBLISHED_DEMO_PASSWORD)) ? row.email : null)),
  );
  return checked.filter((email): email is string => email !== null).sort();
}
