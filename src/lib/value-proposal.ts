/**
 * The "Propose a change" form's values turned into the body of POST /api/v1/amendments: one
 * `revise-value` entry (ΔfH° in kJ/mol with its standard uncertainty) from an existing source or a
 * typed citation. Pure, no Vue; the shared schema checks the result before anything is sent.
 */
import type { AmendmentInput } from '@shared/schemas/amendments';

export interface ValueProposalForm {
  title: string;
  /** Species id or key ("CO2(g)"). */
  species: string;
  /** kJ/mol */
  value: number | null;
  /** kJ/mol, standard uncertainty (k = 1). */
  uncertainty: number | null;
  sourceMode: 'existing' | 'citation';
  sourceId: string | null;
  citation: string;
  rationale: string;
}

/** The amendment body (possibly invalid: the shared schema names what is missing). */
export function valueProposalBody(form: ValueProposalForm): AmendmentInput {
  const source = form.sourceMode === 'existing' ? (form.sourceId ?? '') : { citation: form.citation };
  return {
    title: form.title,
    rationale: form.rationale,
    entries: [
      {
        kind: 'revise-value',
        species: form.species,
        deltaFH: { value: form.value as number, uncertainty: form.uncertainty },
        source,
      },
    ],
  } as AmendmentInput;
}

/** Where each schema path shows its message in the form. */
export function proposalFieldOf(path: string): keyof ValueProposalForm | 'form' {
  if (path === 'title' || path === 'rationale') return path;
  if (path.startsWith('entries.0.deltaFH.value') || path === 'entries.0.deltaFH') return 'value';
  if (path.startsWith('entries.0.deltaFH.uncertainty')) return 'uncertainty';
  if (path.startsWith('entries.0.source')) return 'citation';
  if (path.startsWith('entries.0.species')) return 'species';
  return 'form';
}

/** Evidence the server takes (it checks the content again): PDF, CSV, XLSX, images. */
export const evidenceAccept =
  '.pdf,.csv,.txt,.xlsx,.png,.jpg,.jpeg,.gif,.webp,application/pdf,text/csv,text/plain,image/png,image/jpeg,image/gif,image/webp,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
