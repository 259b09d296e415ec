import type { BuildInfo } from '../schemas/scan-provenance.schema.js';
import type { LikelihoodSource } from '../schemas/likelihood-set.schema.js';
import { FAMILY_CITATIONS, LIKELIHOOD_SOURCE_CITATIONS, METHOD_CITATIONS, REHEATING_CITATIONS, type CitationRecord } from './citation-records.js';

/** What a scan's citation depends on. */
export interface ScanCitationFacts {
  /** A built-in family's key; null for a group's own expression (no paper to cite). */
  family: string | null;
  method: 'slowroll' | 'exact';
  /** N_* fixed or from a reheating history. */
  pivot: 'fixed' | 'reheating';
  /** The sources of the likelihood set the user picked, if any. */
  likelihoodSources?: LikelihoodSource[];
  /** Or the uploaded regions the user picked, each citing its source as given. */
  likelihoodRegions?: { id: number; name: string; source: string }[];
  /** The build the scan was submitted with (its provenance); null when that was not recorded. */
  build: BuildInfo | null;
  /** Year of that build's use: the scan's submission. */
  year: number;
}

/** Sixtyfold itself, at the version and commit that computed the scan. */
export function softwareCitation(build: BuildInfo | null, year: number): CitationRecord {
  const title = 'Sixtyfold: parameter scans of inflationary potentials';
  // Never a version the scan did not record.
  if (!build) return { key: 'sixtyfold', type: 'software', authors: [], title, year, note: 'version and commit not recorded' };
  return {
    key: `sixtyfold${build.engineVersion.replace(/[^0-9a-z]+/gi, '')}`,
    type: 'software', authors: [], title, version: build.engineVersion, year, note: `commit ${build.commit}`,
  };
}

/** A likelihood source: the full record for a built-in one, else its label and citation text as given. */
export function likelihoodSourceCitation(source: LikelihoodSource): CitationRecord {
  return (
    LIKELIHOOD_SOURCE_CITATIONS[source.arxiv] ?? {
      key: `arxiv${source.arxiv.replace(/[^0-9a-z]+/gi, '')}`, type: 'misc', authors: [], title: source.label, eprint: source.arxiv, note: source.citation,
    }
  );
}

/** Everything a scan's results rest on, in the order a reader meets it: the software, the model, the methods, the data. */
export function scanCitations(facts: ScanCitationFacts): CitationRecord[] {
  return [
    softwareCitation(facts.build, facts.year),
    ...(facts.family ? (FAMILY_CITATIONS[facts.family] ?? []) : []),
    ...METHOD_CITATIONS[facts.method],
    ...(facts.pivot === 'reheating' ? REHEATING_CITATIONS : []),
    ...(facts.likelihoodSources ?? []).map(likelihoodSourceCitation),
    ...(facts.likelihoodRegions ?? []).map((region): CitationRecord => ({ key: `region${region.id}`, type: 'misc', authors: [], title: region.name, note: region.source })),
  ];
}
