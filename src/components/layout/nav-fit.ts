/**
 * Which area links fit in the header's row and which go under "More", from measured widths.
 * Pure, so the rule is tested without a browser: the links keep their order; the current page's
 * link is always in the row (so the page is marked where people look); when not all fit, room is
 * kept for the "More" button.
 */

export interface NavFit<T> {
  shown: T[];
  overflow: T[];
}

/**
 * @param items     the links in header order
 * @param widths    each link's width in px by key (as rendered, padding included)
 * @param available the width of the nav row in px
 * @param moreWidth the width of the "More" button in px
 * @param gap       the space between two links in px
 * @param currentKey the link of the page shown, kept in the row when it fits at all
 */
export function fitNavItems<T extends { key: string }>(
  items: readonly T[],
  widths: Readonly<Record<string, number>>,
  available: number,
  moreWidth: number,
  gap: number,
  currentKey: string | null,
): NavFit<T> {
  const width = (item: T) => widths[item.key] ?? 0;
  const total = items.reduce((sum, item, i) => sum + width(item) + (i > 0 ? gap : 0), 0);
  // Half a pixel of slack: measured widths are fractional and rounding must not push a link out.
  if (total <= available + 0.5) return { shown: [...items], overflow: [] };

  let budget = available - moreWidth;
  const keep = new Set<string>();
  const current = items.find((item) => item.key === currentKey);
  const byPriority = current ? [current, ...items.filter((item) => item !== current)] : [...items];
  for (const item of byPriority) {
    const cost = width(item) + gap;
    if (cost > budget + 0.5) {
      // Links further on may be narrower, but skipping one would reorder the row: stop here.
      if (item !== current) break;
      continue;
    }
    keep.add(item.key);
    budget -= cost;
  }
  return {
    shown: items.filter((item) => keep.has(item.key)),
    overflow: items.filter((item) => !keep.has(item.key)),
  };
}
