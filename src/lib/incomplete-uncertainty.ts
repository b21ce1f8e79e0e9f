/** The words for an uncertainty that leaves out values with none stated. Pure. */

/** "A", "A and B", "A, B and C". */
export function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? '';
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** The sentence shown whenever the reply's `uncertaintyComplete` is false. */
export function incompleteUncertaintyText(missing: readonly string[]): string {
  const who =
    missing.length === 0 ? 'some of the values used' : missing.length === 1 ? missing[0]! : listInWords(missing);
  return `The uncertainty is incomplete: no uncertainty is stated for ${who}. The ± figure covers only the values that state one, so the true uncertainty is larger than shown.`;
}
