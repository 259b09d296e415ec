import { Button, Clipboard, Code, HStack, Heading, Link, Stack, Text } from '@chakra-ui/react';
import { ErrorState } from '@/components/ui/error-state';
import { scanCitationBibHref, useScanCitation } from '../api/get-scan-citation';
import { useViewParams } from '../hooks/use-view-params';

/**
 * The citation block: BibTeX for Sixtyfold at the scan's version and commit, the family's papers,
 * the methods papers, and the sources of the likelihood picked on the page (the first in `likelihood=`).
 */
export function ScanCitation({ scanId }: { scanId: number }) {
  const [params] = useViewParams();
  const likelihood = params.get('likelihood')?.split(',').find(Boolean) ?? null;
  const citation = useScanCitation(scanId, likelihood);
  return (
    <Stack gap="2" as="section" aria-labelledby="scan-citation">
      <Heading as="h3" id="scan-citation" size="xs" color="ink.900">
        Cite
      </Heading>
      {citation.isError ? (
        <ErrorState title="Could not load the citation" error={citation.error} onRetry={() => citation.refetch()} />
      ) : citation.isPending ? null : (
        <>
          <Text fontSize="sm" color="fg.muted">
            {likelihood ? `With the sources of ${likelihood}, the likelihood picked on this page.` : 'Pick a likelihood on the Constraints tab to cite its sources too.'}
          </Text>
          <Code as="pre" display="block" whiteSpace="pre-wrap" p="3" maxH="24rem" overflow="auto" aria-label="BibTeX">
            {citation.data.bibtex}
          </Code>
          <HStack gap="3">
            <Clipboard.Root value={citation.data.bibtex}>
              <Clipboard.Trigger asChild>
                <Button size="sm" variant="outline" aria-label="Copy BibTeX">
                  <Clipboard.Indicator />
                  <Clipboard.Context>{(clipboard) => (clipboard.copied ? 'Copied' : 'Copy BibTeX')}</Clipboard.Context>
                </Button>
              </Clipboard.Trigger>
            </Clipboard.Root>
            <Link href={scanCitationBibHref(scanId, likelihood)} download fontSize="sm">
              Download .bib
            </Link>
          </HStack>
        </>
      )}
    </Stack>
  );
}
