import { Button, HStack, Stack, Text } from '@chakra-ui/react';
import { useEffect, useRef, useState } from 'react';
import { AppLink } from '@/components/ui/app-link';
import { paths } from '@/config/paths';
import { useScanLineage } from '../api/get-scan-lineage';
import { RefinedPointsTable, type UseLikelihoodSets } from './refined-points-table';

/**
 * Where a scan sits in refinement chains: the grid it refines, or the levels refining it, and on
 * demand every level's points in one table. Nothing when neither.
 */
export function ScanLineage({
  scanId,
  axes,
  useLikelihoodSets,
  onLevelCompleted,
}: {
  scanId: number;
  axes: string[];
  useLikelihoodSets: UseLikelihoodSets;
  /** A level completed while the page was open: the merged views have more to show. */
  onLevelCompleted: () => void;
}) {
  const lineage = useScanLineage(scanId);
  const [showPoints, setShowPoints] = useState(false);
  const data = lineage.data;
  const completed = data?.levels.filter((level) => level.status === 'completed').length;
  const seen = useRef(completed);
  useEffect(() => {
    if (completed === undefined) return;
    if (seen.current !== undefined && completed > seen.current) onLevelCompleted();
    seen.current = completed;
  }, [completed, onLevelCompleted]);
  if (!data || (data.parentScanId === null && data.levels.length === 0)) return null;
  const anyCompleted = data.levels.some((level) => level.status === 'completed');
  return (
    <Stack gap="1" fontSize="sm" px={{ base: '4', md: '6' }} py="2" aria-label="Refinement lineage">
      {data.parentScanId !== null && (
        <Text>
          Level {data.level} of the refinement of <AppLink to={paths.scan.getHref(data.parentScanId)}>scan {data.parentScanId}</AppLink>; its
          heatmaps and constraints show every level merged.
        </Text>
      )}
      <HStack gap="3" wrap="wrap">
        <Text color="fg.muted">Refinement levels:</Text>
        {data.levels.map((level) => (
          <AppLink key={level.scanId} to={paths.scan.getHref(level.scanId)} aria-current={level.scanId === scanId ? 'page' : undefined}>
            level {level.level} · {level.totalPoints.toLocaleString('en-US')} points · {level.status}
          </AppLink>
        ))}
        {anyCompleted && (
          <Button size="xs" variant="ghost" onClick={() => setShowPoints(!showPoints)}>
            {showPoints ? 'Hide the points of every level' : 'Points of every level'}
          </Button>
        )}
      </HStack>
      {showPoints && <RefinedPointsTable scanId={scanId} axes={axes} useLikelihoodSets={useLikelihoodSets} />}
    </Stack>
  );
}
