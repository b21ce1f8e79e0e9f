// Every table, for drizzle-kit (migrations) and for the typed query API.
export * from './roles';
export * from './users';
export * from './teams';
export * from './sessions';
export * from './api-tokens';
export * from './invitations';
export * from './password-resets';
export * from './audit-log';
export * from './notes';
export * from './library';
export * from './derived-values';
export * from './reaction-sets';
export * from './amendments';
export * from './notifications';
export * from './calorimetry-runs';
