import { Link, Stack, Text } from '@chakra-ui/react';
import type { JudgedLikelihood, LikelihoodSetEntry } from '@sixtyfold/shared';

/**
 * A likelihood's own words about what it is, with a set's sources or the uploaded regions it was
 * built from: shown wherever a likelihood is used.
 */
export function LikelihoodSetNote({ likelihood, named = false }: { likelihood: LikelihoodSetEntry | JudgedLikelihood; named?: boolean }) {
  const regions = 'kind' in likelihood && likelihood.kind === 'regions' ? likelihood : null;
  return (
    <Stack gap="1">
      <Text color="fg.muted">
        {(named || regions) && <strong>{likelihood.name}: </strong>}
        {likelihood.statement}
      </Text>
      {regions ? (
        <Text color="fg.muted">
          Uploaded contours: {regions.regions.map((region) => `${region.name} (${(region.confidenceLevel * 100).toFixed(2)} %, ${region.source})`).join('; ')}
        </Text>
      ) : (
        'sources' in likelihood && (
          <Text color="fg.muted">
            Sources:{' '}
            {likelihood.sources.map((source, i) => (
              <span key={source.arxiv}>
                {i > 0 && '; '}
                {source.label} (
                <Link href={`https://arxiv.org/abs/${source.arxiv}`} target="_blank" rel="noreferrer" title={source.citation}>
                  arXiv:{source.arxiv}
                </Link>
                )
              </span>
            ))}
          </Text>
        )
      )}
    </Stack>
  );
}
