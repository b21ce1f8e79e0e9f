import type { Source } from '@shared/schemas/library';

/**
 * The library sources a set uses as BibTeX entries, keyed by the library's source key. Text stays
 * UTF-8 (biber and BibTeX 0.99 pass it through); only the characters TeX reads as commands are
 * escaped, and titles are braced so styles keep their capitals ("NBS", "KCl").
 */

const TEX_SPECIALS: Record<string, string> = {
  '\\': '\\textbackslash{}',
  '{': '\\{',
  '}': '\\}',
  '&': '\\&',
  '%': '\\%',
  $: '\\$',
  '#': '\\#',
  _: '\\_',
  '~': '\\textasciitilde{}',
  '^': '\\textasciicircum{}',
};

export function texEscape(text: string): string {
  return text.replace(/[\\{}&%$#_~^]/g, (c) => TEX_SPECIALS[c]!);
}

/** "Cox, J. D.; Wagman, D. D." → "Cox, J. D. and Wagman, D. D."; a name without a comma is a body ("{NIST ASD Team}"). */
export function bibtexAuthors(authors: string): string {
  return authors
    .split(';')
    .map((a) => a.trim())
    .filter(Boolean)
    .map((a) => (a.includes(',') ? texEscape(a) : `{${texEscape(a)}}`))
    .join(' and ');
}

/** Page ranges with BibTeX's double hyphen ("467–481" → "467--481"). */
function pages(text: string): string {
  return texEscape(text).replace(/\s*[–—-]\s*/g, '--');
}

const entryType: Record<Source['kind'], string> = {
  'journal-article': 'article',
  book: 'book',
  compilation: 'book',
  report: 'techreport',
  dataset: 'misc',
};

/** The field that names where a source appeared, by entry type. */
const whereField: Record<string, string> = {
  article: 'journal',
  book: 'publisher',
  techreport: 'institution',
  misc: 'howpublished',
};

export function bibtexEntry(source: Source): string {
  const type = entryType[source.kind];
  const fields: [string, string][] = [];
  if (source.authors) fields.push(['author', bibtexAuthors(source.authors)]);
  fields.push(['title', `{${texEscape(source.title)}}`]);
  if (source.publication) fields.push([whereField[type]!, texEscape(source.publication)]);
  if (source.year !== null) fields.push(['year', String(source.year)]);
  if (source.volume) fields.push(['volume', texEscape(source.volume)]);
  if (source.pages) fields.push(['pages', pages(source.pages)]);
  // DOIs and URLs are verbatim fields (biblatex, the url package): written as they are, so "_" stays "_";
  // only braces, which BibTeX itself must balance, keep one out.
  const doi = source.doi?.replace(/^https?:\/\/(dx\.)?doi\.org\//i, '');
  if (doi && !/[{}]/.test(doi)) fields.push(['doi', doi]);
  if (source.isbn) fields.push(['isbn', texEscape(source.isbn)]);
  if (source.url && !/[{}]/.test(source.url)) fields.push(['url', source.url]);
  if (source.note) fields.push(['note', texEscape(source.note)]);
  const body = fields.map(([name, value]) => `  ${name} = {${value}}`).join(',\n');
  return `@${type}{${source.key},\n${body}\n}`;
}

/**
 * A calibrant's certificate as cited with a bomb run (free text, e.g. "NIST SRM 39j, benzoic acid,
 * certificate of analysis"): a @misc entry whose title is the citation as typed.
 */
export function certificateEntry(citation: string, key: string): string {
  return `@misc{${key},\n  title = {{${texEscape(citation.replace(/\s+/g, ' ').trim())}}},\n  note = {Calibrant certificate of a bomb-calorimetry run}\n}`;
}

/**
 * Every source as one .bib text, with a comment naming the set and the library revision; the
 * calibrant certificates cited by bomb runs follow as `calibrant-1`, `calibrant-2`… in first-use order.
 */
export function setBibtex(
  sources: readonly Source[],
  about: { title: string; revision: number },
  certificates: readonly string[] = [],
): string {
  const header = `% Sources of the reaction set "${about.title.replace(/[\r\n@{}]+/g, ' ')}", Thermoledger library revision ${about.revision}.\n`;
  const entries = [
    ...sources.map(bibtexEntry),
    ...[...new Set(certificates)].map((c, i) => certificateEntry(c, `calibrant-${i + 1}`)),
  ];
  return `${header}\n${entries.join('\n\n')}\n`;
}
