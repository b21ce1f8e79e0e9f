/**
 * A library formula or key as HTML with sub- and superscripts (`Co^2+(aq)` → Co<sup>2+</sup>(aq)),
 * through the equation core's own formatter, which escapes every character it did not build.
 * Text that the core cannot read is escaped and shown as it is.
 */
import { formatEquation, formatFormula, parseEquation, parseFormula } from '@shared/chemistry/index';

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => escapes[c]!);
}

const cache = new Map<string, string>();

export function formulaHtml(text: string): string {
  let html = cache.get(text);
  if (html === undefined) {
    try {
      html = formatFormula(parseFormula(text), 'html');
    } catch {
      html = escapeHtml(text);
    }
    if (cache.size > 5000) cache.clear();
    cache.set(text, html);
  }
  return html;
}

/** A whole equation as HTML through the core's formatter (arrow as →); escaped text when unreadable. */
export function equationHtml(text: string): string {
  try {
    return formatEquation(parseEquation(text), 'html');
  } catch {
    return escapeHtml(text);
  }
}
