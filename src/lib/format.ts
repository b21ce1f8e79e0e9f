/** Small display helpers shared by the tables. Pure and locale-explicit so tests are stable. */

/** "12 Mar 2025, 14:05" in the given locale and time zone; "—" for null. */
export function formatDateTime(iso: string | null, locale = 'en-GB', timeZone?: string): string {
  if (iso === null) return '—';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat(locale, {
    dateStyle: 'medium',
    timeStyle: 'short',
    ...(timeZone ? { timeZone } : {}),
  }).format(date);
}

/** The text of an e-mail split into plain pieces and links, so links can be made clickable without v-html. */
export function splitLinks(text: string): Array<{ kind: 'text' | 'link'; value: string }> {
  const out: Array<{ kind: 'text' | 'link'; value: string }> = [];
  const pattern = /https?:\/\/[^\s<>"')]+/g;
  let last = 0;
  for (const match of text.matchAll(pattern)) {
    const start = match.index ?? 0;
    // A sentence's full stop or comma after a link is not part of it.
    const url = match[0].replace(/[.,;:!?]+$/, '');
    if (start > last) out.push({ kind: 'text', value: text.slice(last, start) });
    out.push({ kind: 'link', value: url });
    last = start + url.length;
  }
  if (last < text.length) out.push({ kind: 'text', value: text.slice(last) });
  return out;
}

/** Same-origin links open inside the app (router), others in a new tab. Returns the in-app path or null. */
export function inAppPath(url: string, origin: string): string | null {
  try {
    const parsed = new URL(url);
    return parsed.origin === origin ? parsed.pathname + parsed.search + parsed.hash : null;
  } catch {
    return null;
  }
}
