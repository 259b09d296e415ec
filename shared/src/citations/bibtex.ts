import type { CitationRecord } from './citation-records.js';

/** Greek letters that appear in titles, as LaTeX math (BibTeX itself reads bytes, not letters). */
const GREEK: Record<string, string> = { α: '\\alpha', β: '\\beta', γ: '\\gamma', δ: '\\delta', ε: '\\epsilon', η: '\\eta', Λ: '\\Lambda', ξ: '\\xi', φ: '\\phi' };

/**
 * Plain text as a BibTeX field value: LaTeX's special characters escaped (a backslash, braces,
 * & % $ # _ ~ ^), the Greek letters above as math; other characters stay as they are (UTF-8, as
 * biber and bibtexu read them).
 */
export function escapeBibtex(text: string): string {
  return text.replace(/[\\{}&%$#_~^]|[αβγδεηΛξφ]/g, (c) => {
    if (c === '\\') return '\\textbackslash{}';
    if (c === '~') return '\\textasciitilde{}';
    if (c === '^') return '\\textasciicircum{}';
    if (GREEK[c]) return `{$${GREEK[c]}$}`;
    return `\\${c}`;
  });
}

/** An author list: persons as given ("Last, First"), a collaboration braced so BibTeX keeps it whole. */
function authorField(authors: string[]): string {
  return authors.map((a) => (a === 'others' ? a : a.includes(',') ? escapeBibtex(a) : `{${escapeBibtex(a)}}`)).join(' and ');
}

/** One entry. The title is braced twice, so styles keep its capitals. */
export function bibtexEntry(record: CitationRecord): string {
  const fields: [string, string][] = [];
  if (record.authors.length > 0) fields.push(['author', `{${authorField(record.authors)}}`]);
  fields.push(['title', `{{${escapeBibtex(record.title)}}}`]);
  if (record.journal) fields.push(['journal', `{${escapeBibtex(record.journal)}}`]);
  if (record.volume) fields.push(['volume', `{${escapeBibtex(record.volume)}}`]);
  if (record.pages) fields.push(['pages', `{${escapeBibtex(record.pages)}}`]);
  if (record.year !== undefined) fields.push(['year', `{${record.year}}`]);
  if (record.version) fields.push(['version', `{${escapeBibtex(record.version)}}`]);
  if (record.eprint) fields.push(['eprint', `{${escapeBibtex(record.eprint)}}`], ['archivePrefix', '{arXiv}']);
  if (record.note) fields.push(['note', `{${escapeBibtex(record.note)}}`]);
  return `@${record.type}{${record.key},\n${fields.map(([name, value]) => `  ${name} = ${value}`).join(',\n')}\n}\n`;
}

/**
 * The records as one .bib text, one entry per key in first-seen order: a work cited by two parts
 * (a family and a likelihood set, say) appears once. Two different records under one key are a bug.
 */
export function toBibtex(records: CitationRecord[]): string {
  const seen = new Map<string, CitationRecord>();
  for (const record of records) {
    const earlier = seen.get(record.key);
    if (earlier && earlier !== record && bibtexEntry(earlier) !== bibtexEntry(record)) {
      throw new Error(`two different citations under the key ${record.key}`);
    }
    if (!earlier) seen.set(record.key, record);
  }
  return [...seen.values()].map(bibtexEntry).join('\n');
}
