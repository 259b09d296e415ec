import { DataList, Text } from '@chakra-ui/react';
import { ScanGrid, variedInputs, type ScanPoints, type StoredScanSpec } from '@sixtyfold/shared';
import { formatNumber } from '@/lib/format-number';
import { inputLabel } from '@/lib/point-labels';
import { isPivotAxis } from '../../utils/scan-spec';

interface PointInputsProps {
  spec: StoredScanSpec;
  points: ScanPoints;
  pointIndex: number;
  /** The start the engine used, once known (families compute their own). */
  phiInitUsed?: number | null;
}

const mono = { fontFamily: 'mono' } as const;

/** Where the point sits in the grid (or the list) and everything else its evaluation took. */
export function PointInputs({ spec, points, pointIndex, phiInitUsed }: PointInputsProps) {
  const grid = points instanceof ScanGrid ? points : null;
  const indices = grid?.indices(pointIndex);
  const values = points.point(pointIndex);
  const pivot = spec.pivot;
  const varied = variedInputs(spec);
  const onAxes = new Set(varied);
  return (
    <DataList.Root orientation="horizontal" size="sm" gap="2.5">
      {varied.map((name, a) => (
        <DataList.Item key={name}>
          <DataList.ItemLabel>{inputLabel(name)}</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>
            {formatNumber(values[name])}
            <Text as="span" color="fg.muted" fontFamily="body" ms="2">
              {grid && indices ? `axis value ${indices[a] + 1} of ${grid.lengths[a]}` : `point ${pointIndex + 1} of ${points.size} in the list`}
            </Text>
          </DataList.ItemValue>
        </DataList.Item>
      ))}
      {Object.entries(spec.params)
        .filter(([name]) => !isPivotAxis(name))
        .map(([name, value]) => (
          <DataList.Item key={name}>
            <DataList.ItemLabel>{name}</DataList.ItemLabel>
            <DataList.ItemValue {...mono}>
              {formatNumber(value)}
              <Text as="span" color="fg.muted" fontFamily="body" ms="2">
                fixed
              </Text>
            </DataList.ItemValue>
          </DataList.Item>
        ))}
      {pivot.kind === 'fixed' && pivot.nStar !== undefined && (
        <DataList.Item>
          <DataList.ItemLabel>N_*</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>{formatNumber(pivot.nStar)}</DataList.ItemValue>
        </DataList.Item>
      )}
      {pivot.kind === 'reheating' && (
        <DataList.Item>
          <DataList.ItemLabel>N_*</DataList.ItemLabel>
          <DataList.ItemValue>
            from reheating
            {!onAxes.has('reheatingW') && ` with w_reh = ${formatNumber(pivot.w)}`}
            {!onAxes.has('reheatingEnergyGeV') && `, ρ_reh^1/4 = ${formatNumber(pivot.energyGeV)} GeV`}
          </DataList.ItemValue>
        </DataList.Item>
      )}
      <DataList.Item>
        <DataList.ItemLabel>φ_init</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>
          {spec.phiInit !== undefined ? formatNumber(spec.phiInit) : phiInitUsed != null ? formatNumber(phiInitUsed) : 'the family’s own start'}
          {spec.phiInit === undefined && phiInitUsed != null && (
            <Text as="span" color="fg.muted" fontFamily="body" ms="2">
              the family’s start for these parameters
            </Text>
          )}
        </DataList.ItemValue>
      </DataList.Item>
    </DataList.Root>
  );
}
