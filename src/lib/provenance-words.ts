/** Short words for provenance states in tight places (tables); the full words are `provenanceLabels`. */
import { provenanceLabels, type Provenance } from '@shared/schemas/library-core';

export const provenanceShort: Record<Provenance, string> = {
  entered: 'entered, unchecked',
  checked: 'checked',
  memory: 'typed from memory',
  derived: 'derived',
  superseded: 'superseded',
};

export { provenanceLabels };

/** Memory values need the reader's eye: they are not yet checked against any source. */
export function needsAttention(p: Provenance): boolean {
  return p === 'memory';
}
