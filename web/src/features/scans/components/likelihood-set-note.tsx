import { Link, Stack, Text } from '@chakra-ui/react';
import type { LikelihoodSetEntry } from '@sixtyfold/shared';

/** A set's own words about what it approximates, and its sources: shown wherever a set is used. */
export function LikelihoodSetNote({ set, named = false }: { set: Pick<LikelihoodSetEntry, 'name' | 'statement' | 'sources'>; named?: boolean }) {
  return (
    <Stack gap="1">
      <Text color="fg.muted">
        {named && <strong>{set.name}: </strong>}
        {set.statement}
      </Text>
      <Text color="fg.muted">
        Sources:{' '}
        {set.sources.map((source, i) => (
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
    </Stack>
  );
}
