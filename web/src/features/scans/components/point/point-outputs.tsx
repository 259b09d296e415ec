import { Badge, Table, Text } from '@chakra-ui/react';
import { POINT_OUTPUTS, type EvaluateResponse, type PointOutput, type ScanPointDto } from '@sixtyfold/shared';
import { outputLabel } from '../../utils/output-labels';

interface PointOutputsProps {
  /** The stored point, or null when it is not stored yet. */
  stored: ScanPointDto | null;
  /** The same point evaluated again in the browser, once done. */
  recomputed?: EvaluateResponse;
}

// Every digit a double holds: "identical" has to be visible, not rounded into being.
const exact = (value: number | null | undefined) => (value === null || value === undefined ? '—' : String(value));

/** How a recomputed value compares with the stored one; the engine is deterministic, so equality is expected. */
export function agreement(stored: number | null, recomputed: number | null): 'identical' | 'both empty' | 'differs' {
  if (stored === null && recomputed === null) return 'both empty';
  return stored !== null && recomputed !== null && Object.is(stored, recomputed) ? 'identical' : 'differs';
}

function Verdict({ verdict }: { verdict: ReturnType<typeof agreement> }) {
  if (verdict === 'both empty') {
    return (
      <Text as="span" color="fg.subtle" fontSize="sm">
        none in either
      </Text>
    );
  }
  return (
    <Badge colorPalette={verdict === 'identical' ? 'green' : 'red'} variant="subtle" size="sm">
      {verdict}
    </Badge>
  );
}

/** Stored outputs beside the ones just recomputed, output by output. */
export function PointOutputs({ stored, recomputed }: PointOutputsProps) {
  return (
    <Table.ScrollArea>
      <Table.Root size="sm" aria-label="Stored and recomputed outputs">
        <Table.Header>
          <Table.Row bg="bg.subtle">
            <Table.ColumnHeader>Output</Table.ColumnHeader>
            <Table.ColumnHeader>Stored</Table.ColumnHeader>
            <Table.ColumnHeader>Recomputed here</Table.ColumnHeader>
            <Table.ColumnHeader>Agreement</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          <Table.Row>
            <Table.Cell fontWeight="500" color="ink.900">
              Status
            </Table.Cell>
            <Table.Cell fontFamily="mono" fontSize="sm">
              {stored ? stored.status : <Text as="span" color="fg.subtle">not stored</Text>}
            </Table.Cell>
            <Table.Cell fontFamily="mono" fontSize="sm">
              {recomputed ? recomputed.status : <Text as="span" color="fg.subtle">…</Text>}
            </Table.Cell>
            <Table.Cell>
              {stored && recomputed && <Verdict verdict={stored.status === recomputed.status ? 'identical' : 'differs'} />}
            </Table.Cell>
          </Table.Row>
          {POINT_OUTPUTS.map((output: PointOutput) => {
            const storedValue = stored ? stored[output] : null;
            const fresh = recomputed ? recomputed[output] : undefined;
            const verdict = stored && fresh !== undefined ? agreement(storedValue, fresh) : null;
            return (
              <Table.Row key={output}>
                <Table.Cell fontWeight="500" color="ink.900">
                  {outputLabel(output)}
                </Table.Cell>
                <Table.Cell fontFamily="mono" fontSize="sm">
                  {stored ? exact(storedValue) : <Text as="span" color="fg.subtle">not stored</Text>}
                </Table.Cell>
                <Table.Cell fontFamily="mono" fontSize="sm">
                  {recomputed ? exact(fresh) : <Text as="span" color="fg.subtle">…</Text>}
                </Table.Cell>
                <Table.Cell>{verdict && <Verdict verdict={verdict} />}</Table.Cell>
              </Table.Row>
            );
          })}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
