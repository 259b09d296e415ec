import { DataList, Text } from '@chakra-ui/react';
import type { ScanGrid, StoredScanSpec } from '@sixtyfold/shared';
import { formatValue, inputLabel } from '../../utils/point-columns';
import { isPivotAxis } from '../../utils/scan-spec';

interface PointInputsProps {
  spec: StoredScanSpec;
  grid: ScanGrid;
  pointIndex: number;
  /** The start the engine used, once known (families compute their own). */
  phiInitUsed?: number | null;
}

const mono = { fontFamily: 'mono' } as const;

/** Where the point sits in the grid and everything else its evaluation took. */
export function PointInputs({ spec, grid, pointIndex, phiInitUsed }: PointInputsProps) {
  const indices = grid.indices(pointIndex);
  const pivot = spec.pivot;
  const onAxes = new Set(spec.axes.map((axis) => axis.parameter));
  return (
    <DataList.Root orientation="horizontal" size="sm" gap="2.5">
      {spec.axes.map((axis, a) => (
        <DataList.Item key={axis.parameter}>
          <DataList.ItemLabel>{inputLabel(axis.parameter)}</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>
            {formatValue(grid.values[a][indices[a]])}
            <Text as="span" color="fg.muted" fontFamily="body" ms="2">
              axis value {indices[a] + 1} of {grid.lengths[a]}
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
              {formatValue(value)}
              <Text as="span" color="fg.muted" fontFamily="body" ms="2">
                fixed
              </Text>
            </DataList.ItemValue>
          </DataList.Item>
        ))}
      {pivot.kind === 'fixed' && pivot.nStar !== undefined && (
        <DataList.Item>
          <DataList.ItemLabel>N_*</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>{formatValue(pivot.nStar)}</DataList.ItemValue>
        </DataList.Item>
      )}
      {pivot.kind === 'reheating' && (
        <DataList.Item>
          <DataList.ItemLabel>N_*</DataList.ItemLabel>
          <DataList.ItemValue>
            from reheating
            {!onAxes.has('reheatingW') && ` with w_reh = ${formatValue(pivot.w)}`}
            {!onAxes.has('reheatingEnergyGeV') && `, ρ_reh^1/4 = ${formatValue(pivot.energyGeV)} GeV`}
          </DataList.ItemValue>
        </DataList.Item>
      )}
      <DataList.Item>
        <DataList.ItemLabel>φ_init</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>
          {spec.phiInit !== undefined ? formatValue(spec.phiInit) : phiInitUsed != null ? formatValue(phiInitUsed) : 'the family’s own start'}
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
