import { h } from 'vue';

/**
 * Title of a data table's row-actions column: read by screen readers, not shown, so the header
 * cell is never empty (axe: empty-table-header) and the column stays narrow.
 */
export const actionsColumnTitle = () => h('span', { class: 'tl-visually-hidden' }, 'Actions');
