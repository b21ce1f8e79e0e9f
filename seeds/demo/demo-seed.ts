// The invented demo scenario (Kestrel Bay Process Lab and Larchmont Polymers Pilot Hall), read from
// the JSON files beside this module. The one place that knows the demo accounts and their password.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { siteRoleSchema, teamRoleSchema } from '@shared/schemas/roles';

/**
 * The password every demo account gets unless another is given (README publishes it). A server
 * started with NODE_ENV=production refuses to run while a demo account still accepts it.
 */
export const PUBLISHED_DEMO_PASSWORD = 'thermoledger-demo';

/** The part each demo account plays; tests and the E2E suite pick accounts by these keys. */
export const demoAccountKeys = ['viewer', 'member', 'team_admin', 'curator', 'site_admin', 'other_team'] as const;
export type DemoAccountKey = (typeof demoAccountKeys)[number];

const seedDir = path.dirname(fileURLToPath(import.meta.url));

const demoTeamsSchema = z.array(z.object({ slug: z.string(), name: z.string(), about: z.string().optional() }));
const demoUsersSchema = z.array(
  z.object({
    key: z.enum(demoAccountKeys),
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
  const seed = {
    teams: readJson('teams.json', demoTeamsSchema),
    users: readJson('users.json', demoUsersSchema),
    notes: readJson('notes.json', demoNotesSchema),
  };
  const missing = demoAccountKeys.filter((key) => !seed.users.some((u) => u.key === key));
  if (missing.length > 0) throw new Error(`seeds/demo/users.json has no account for ${missing.join(', ')}`);
  return seed;
}

const demoReactionsSchema = z.array(
  z.object({ id: z.string(), team: z.string(), label: z.string(), equation: z.string() }),
);
export type DemoReaction = z.infer<typeof demoReactionsSchema>[number];

/**
 * The reactions the demo teams work on (seeds/demo/reactions.json): what the impact of a library
 * amendment is shown on. Not written to the database; read where they are evaluated.
 */
export function loadDemoReactions(): DemoReaction[] {
  return readJson('reactions.json', demoReactionsSchema);
}

/** E-mail of each demo account, by the part it plays. */
export const demoAccounts: Readonly<Record<DemoAccountKey, string>> = Object.fromEntries(
  loadDemoSeed().users.map((u) => [u.key, u.email]),
) as Record<DemoAccountKey, string>;
