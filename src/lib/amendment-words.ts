/**
 * Words and small decisions for the curation pages. Pure: no Vue, no naive-ui.
 */
import type { AmendmentState, DiffSide } from '@shared/schemas/amendments';
import type { SessionInfo } from '@shared/schemas/session';

/** Who may propose: a member or team admin of at least one team, or a curator (the server's 'proposer'). */
export function canPropose(session: SessionInfo): boolean {
  if (session.user === null) return false;
  if (session.user.siteRoles.includes('curator')) return true;
  return session.teams.some((t) => t.role === 'member' || t.role === 'team_admin');
}

export function isCurator(session: SessionInfo): boolean {
  return session.user?.siteRoles.includes('curator') ?? false;
}

/** Short state names for tags and filters. */
export const stateShortLabels: Record<AmendmentState, string> = {
  draft: 'Draft',
  open: 'Open',
  accepted: 'Accepted',
  returned: 'Returned',
  declined: 'Declined',
  withdrawn: 'Withdrawn',
};

export const stateTagType: Record<AmendmentState, 'default' | 'info' | 'success' | 'warning' | 'error'> = {
  draft: 'default',
  open: 'info',
  accepted: 'success',
  returned: 'warning',
  declined: 'error',
  withdrawn: 'default',
};

/** Whole days between an ISO time and now. */
export function ageInDays(iso: string, now: number = Date.now()): number {
  return Math.max(0, Math.floor((now - Date.parse(iso)) / 86_400_000));
}

export function ageText(iso: string, now: number = Date.now()): string {
  const d = ageInDays(iso, now);
  return d === 0 ? 'today' : d === 1 ? '1 day' : `${d} days`;
}

/** A signed number with a true minus sign. */
export function signed(x: number, digits = 2): string {
  const text = Math.abs(x).toFixed(digits);
  return x < 0 ? `−${text}` : x > 0 ? `+${text}` : text;
}

/** A value with its standard uncertainty: "−393.51 ± 0.13 kJ/mol". */
export function valueText(value: number | null, uncertainty: number | null, unit: string | null = null): string {
  if (value === null) return '—';
  const v = value < 0 ? `−${Math.abs(value)}` : String(value);
  const u = uncertainty === null ? ' (no uncertainty stated)' : ` ± ${uncertainty}`;
  return `${v}${u}${unit ? ` ${unit}` : ''}`;
}

/** One side of a diff line in words (null: nothing there). */
export function diffSideText(side: DiffSide | null): string {
  if (side === null) return '—';
  if (side.value !== null) return valueText(side.value, side.uncertainty, side.unit);
  return side.text ?? '—';
}
