/** The search options a caller can get wrong. */
export type SpeciesSearchOptionField = 'limit' | 'offset' | 'phase' | 'elements';

/**
 * A search option out of range (`limit` 0, an unknown element symbol). The query itself never
 * throws: any text is a valid query, at worst with no hits.
 */
export class SpeciesSearchOptionError extends RangeError {
  override readonly name = 'SpeciesSearchOptionError';
  constructor(
    readonly field: SpeciesSearchOptionField,
    message: string,
  ) {
    super(message);
  }
}
