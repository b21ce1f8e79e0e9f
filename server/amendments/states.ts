import { amendmentStateLabels, type AmendmentAction, type AmendmentState } from '@shared/schemas/amendments';
import { AppError } from '../errors';

/**
 * The amendment state machine: which action works from which states, what it leads to, and who
 * may take it. The service checks, in this order: the caller may see the amendment (404), may
 * take the action (403), and the action works from the current state (409 naming the state).
 *
 *   draft ──open──▶ open ──accept──▶ accepted
 *     ▲               │ ──decline─▶ declined
 *     │ (edit)        └──return──▶ returned ──open──▶ open
 *   draft, open, returned ──withdraw──▶ withdrawn
 */

export type Transition = { from: readonly AmendmentState[]; to: AmendmentState | 'same' };

export const transitions: Record<Exclude<AmendmentAction, 'create'>, Transition> = {
  edit: { from: ['draft', 'returned'], to: 'same' },
  open: { from: ['draft', 'returned'], to: 'open' },
  accept: { from: ['open'], to: 'accepted' },
  return: { from: ['open'], to: 'returned' },
  decline: { from: ['open'], to: 'declined' },
  withdraw: { from: ['draft', 'open', 'returned'], to: 'withdrawn' },
  rebase: { from: ['draft', 'open', 'returned'], to: 'same' },
};

/** States no action leaves. */
export const finalStates: readonly AmendmentState[] = ['accepted', 'declined', 'withdrawn'];

const verbs: Record<keyof typeof transitions, string> = {
  edit: 'edited',
  open: 'opened for review',
  accept: 'accepted',
  return: 'returned',
  decline: 'declined',
  withdraw: 'withdrawn',
  rebase: 'rebased',
};

/** The state after `action`, or a 409 naming the current state. */
export function nextState(state: AmendmentState, action: keyof typeof transitions): AmendmentState {
  const t = transitions[action];
  if (!t.from.includes(state))
    throw new AppError(
      'conflict',
      `The amendment is ${state} (${amendmentStateLabels[state].toLowerCase()}), so it cannot be ${verbs[action]}: that works on ${t.from.join(', ')} amendments only.`,
      { state, action, allowedFrom: [...t.from] },
    );
  return t.to === 'same' ? state : t.to;
}

/** Who is asking, as far as amendments care. */
export interface Reviewer {
  isAuthor: boolean;
  isCurator: boolean;
  /** Member or team admin of some team, or curator. */
  isProposer: boolean;
}

/** Whether the caller may take an action (leaving the state aside). */
export function mayTake(action: keyof typeof transitions | 'comment' | 'revert', who: Reviewer): boolean {
  switch (action) {
    case 'edit':
    case 'open':
    case 'withdraw':
      return who.isAuthor;
    case 'accept':
    case 'return':
    case 'decline':
      // Four eyes: nobody reviews their own amendment, not even a curator or a site admin.
      return who.isCurator && !who.isAuthor;
    case 'rebase':
    case 'comment':
      return who.isAuthor || who.isCurator;
    case 'revert':
      return who.isProposer;
  }
}

/** The 403 for an action the caller may not take. */
export function refusal(action: keyof typeof transitions | 'comment' | 'revert', who: Reviewer): AppError {
  switch (action) {
    case 'accept':
    case 'return':
    case 'decline':
      return who.isAuthor
        ? new AppError(
            'forbidden',
            'Nobody reviews their own amendment: another curator must accept, return or decline it.',
            {
              rule: 'four-eyes',
            },
          )
        : new AppError('forbidden', 'Only a curator may review amendments.');
    case 'rebase':
    case 'comment':
      return new AppError('forbidden', `Only the amendment's author and curators may ${action} it.`);
    case 'revert':
      return new AppError('forbidden', 'Proposing a revert needs the role Member in a team, or the site role Curator.');
    default:
      return new AppError('forbidden', `Only the amendment's author may ${action} it.`);
  }
}
