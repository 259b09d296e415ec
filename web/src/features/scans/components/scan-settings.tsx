import { DataList, Table, Text } from '@chakra-ui/react';
import { axisValues, type ScanAxis, type StoredScanSpec } from '@sixtyfold/shared';
import { inputLabel } from '@/lib/point-labels';
import { formatNumber } from '@/lib/format-number';
import { methodLabels } from '@/lib/method-labels';

function pivotText(spec: StoredScanSpec): string {
  const pivot = spec.pivot;
  if (pivot.kind === 'fixed') return pivot.nStar === undefined ? 'N_* on an axis' : `N_* = ${formatNumber(pivot.nStar)}`;
  const w = pivot.w === undefined ? 'w_reh on an axis' : `w_reh = ${formatNumber(pivot.w)}`;
  const energy = pivot.energyGeV === undefined ? 'ρ_reh^1/4 on an axis' : `ρ_reh^1/4 = ${formatNumber(pivot.energyGeV)} GeV`;
  return `From reheating: ${w}, ${energy}`;
}

function axisText(axis: ScanAxis): string {
  if (axis.kind === 'range') {
    if (axis.count === 1) return `${formatNumber(axis.min)} (1 value)`;
    return `${formatNumber(axis.min)} to ${formatNumber(axis.max)}, ${axis.count.toLocaleString('en-US')} values, ${axis.spacing === 'log' ? 'log' : 'linear'} spacing`;
  }
  const values = axisValues(axis);
  const shown = values.slice(0, 6).map((value) => formatNumber(value)).join(', ');
  return `List of ${values.length.toLocaleString('en-US')} values: ${shown}${values.length > 6 ? ', …' : ''}`;
}

const mono = { fontFamily: 'mono' } as const;

/** How the scan was set up: method, pivot, start, fixed parameters and the axes in grid order. */
export function ScanSettings({ spec }: { spec: StoredScanSpec }) {
  const fixed = Object.entries(spec.params);
  return (
    <DataList.Root orientation="horizontal" size="sm" gap="2.5">
      <DataList.Item>
        <DataList.ItemLabel>Method</DataList.ItemLabel>
        <DataList.ItemValue>{methodLabels[spec.method]}</DataList.ItemValue>
      </DataList.Item>
      <DataList.Item>
        <DataList.ItemLabel>Tolerance</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>{spec.tolerance === undefined ? 'engine default' : formatNumber(spec.tolerance)}</DataList.ItemValue>
      </DataList.Item>
      <DataList.Item>
        <DataList.ItemLabel>Pivot</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>{pivotText(spec)}</DataList.ItemValue>
      </DataList.Item>
      <DataList.Item>
        <DataList.ItemLabel>φ_init</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>{spec.phiInit === undefined ? 'the family’s own start' : formatNumber(spec.phiInit)}</DataList.ItemValue>
      </DataList.Item>
      <DataList.Item>
        <DataList.ItemLabel>Fixed</DataList.ItemLabel>
        <DataList.ItemValue {...mono}>
          {fixed.length === 0 ? 'nothing' : fixed.map(([name, value]) => `${inputLabel(name)} = ${formatNumber(value)}`).join(', ')}
        </DataList.ItemValue>
      </DataList.Item>
      {spec.pointList && (
        <DataList.Item>
          <DataList.ItemLabel>Points</DataList.ItemLabel>
          <DataList.ItemValue {...mono}>
            {`${spec.pointList.rows.length.toLocaleString('en-US')} from a file, columns ${spec.pointList.columns.map(inputLabel).join(', ')}`}
          </DataList.ItemValue>
        </DataList.Item>
      )}
      {spec.axes && (
      <DataList.Item alignItems="start">
        <DataList.ItemLabel>Axes</DataList.ItemLabel>
        <DataList.ItemValue minW="0">
          <Table.Root size="sm" variant="outline" aria-label="Scan axes">
            <Table.Body>
              {spec.axes.map((axis, index) => (
                <Table.Row key={axis.parameter}>
                  <Table.Cell {...mono} fontWeight="600" color="ink.900" w="1%" whiteSpace="nowrap">
                    {inputLabel(axis.parameter)}
                  </Table.Cell>
                  <Table.Cell {...mono}>
                    {axisText(axis)}
                    {index === spec.axes!.length - 1 && spec.axes!.length > 1 && (
                      <Text as="span" color="fg.muted" fontFamily="body">
                        {' '}
                        (varies fastest)
                      </Text>
                    )}
                  </Table.Cell>
                </Table.Row>
              ))}
            </Table.Body>
          </Table.Root>
        </DataList.ItemValue>
      </DataList.Item>
      )}
    </DataList.Root>
  );
}
