/**
 * A library source as a full citation: authors, title, publication, volume, pages, year, and
 * its identifiers as links (DOI, ISBN, URL). Pure.
 */
import type { Source } from '@shared/schemas/library';

export interface CitationParts {
  authors: string;
  title: string;
  /** "Journal of Physical and Chemical Reference Data 11, Suppl. 2 (1982)". */
  where: string;
  links: { label: string; href: string | null; text: string }[];
}

export function citationParts(source: Source): CitationParts {
  const pieces: string[] = [];
  if (source.publication) pieces.push(source.publication);
  if (source.volume) pieces.push(source.volume);
  let where = pieces.join(' ');
  if (source.pages) where += `${where ? ', ' : ''}${source.pages}`;
  if (source.year !== null) where += `${where ? ' ' : ''}(${source.year})`;
  const links: CitationParts['links'] = [];
  if (source.doi) {
    const doi = source.doi.replace(/^https?:\/\/(dx\.)?doi\.org\//i, '');
    links.push({ label: 'DOI', href: `https://doi.org/${encodeURI(doi)}`, text: doi });
  }
  if (source.isbn) links.push({ label: 'ISBN', href: null, text: source.isbn });
  if (source.url && /^https?:\/\//i.test(source.url)) links.push({ label: 'URL', href: source.url, text: source.url });
  return { authors: source.authors, title: source.title, where, links };
}
