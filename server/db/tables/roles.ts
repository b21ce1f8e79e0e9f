import { pgEnum } from 'drizzle-orm/pg-core';
import { teamRoles } from '../../../shared/schemas/roles';

/** Team roles as a PostgreSQL enum, in the order shared/schemas/roles.ts defines. */
export const teamRoleEnum = pgEnum('team_role', teamRoles);
