import { describe, expect, it } from 'vitest';
import { fitNavItems } from '@/components/layout/nav-fit';

const items = ['workbench', 'library', 'derive', 'sets', 'notes', 'members'].map((key) => ({ key }));
const widths = { workbench: 100, library: 80, derive: 70, sets: 50, notes: 100, members: 90 };
// 100 + 80 + 70 + 50 + 100 + 90 = 490 px of links, 5 gaps of 4 px: 510 px in all.
const keys = (list: { key: string }[]) => list.map((i) => i.key);

describe('fitNavItems', () => {
  it('keeps every link in the row when they all fit, with no More', () => {
    const fit = fitNavItems(items, widths, 510, 60, 4, null);
    expect(keys(fit.shown)).toEqual(keys(items));
    expect(fit.overflow).toEqual([]);
  });

  it('moves the last links under More when one pixel is missing, keeping room for the button', () => {
    const fit = fitNavItems(items, widths, 509, 60, 4, null);
    // 509 − 60 = 449 for links: workbench 104, library 84, derive 74, sets 54, notes 104 → 420; members would need 94.
    expect(keys(fit.shown)).toEqual(['workbench', 'library', 'derive', 'sets', 'notes']);
    expect(keys(fit.overflow)).toEqual(['members']);
  });

  it('keeps the current page in the row, in its place, pushing earlier links out instead', () => {
    const fit = fitNavItems(items, widths, 400, 60, 4, 'members');
    // 340 for links: members 94, workbench 104, library 84 → 282; derive would need 74.
    expect(keys(fit.shown)).toEqual(['workbench', 'library', 'members']);
    expect(keys(fit.overflow)).toEqual(['derive', 'sets', 'notes']);
  });

  it('never reorders: a narrow link after one that does not fit goes under More too', () => {
    const fit = fitNavItems(items, { ...widths, derive: 300 }, 400, 60, 4, null);
    expect(keys(fit.shown)).toEqual(['workbench', 'library']);
    expect(keys(fit.overflow)).toEqual(['derive', 'sets', 'notes', 'members']);
  });

  it('puts everything under the menu when not even one link fits', () => {
    const fit = fitNavItems(items, widths, 90, 60, 4, 'sets');
    expect(fit.shown).toEqual([]);
    expect(keys(fit.overflow)).toEqual(keys(items));
  });
});
