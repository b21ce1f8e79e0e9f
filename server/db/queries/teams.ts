import { sql } from 'drizzle-orm';
import type { Executor } from '../client';
import { teams } from '../tables/index';

/** Turns a team name into a unique URL slug ("Kestrel Bay Lab" → "kestrel-bay-lab", then "-2"…). */
export async function uniqueSlug(exec: Executor, name: string): Promise<string> {
  const base =
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'team';
  const taken = await exec
    .select({ slug: teams.slug })
    .from(teams)
    .where(sql`${teams.slug} = ${base} or ${teams.slug} like ${base + '-%'}`);
  const used = new Set(taken.map((t) => t.slug));
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
}
