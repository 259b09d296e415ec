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

/**
 * Below this relative difference two results are the same computation rounded differently. The
 * engine code is the same here and on the workers, but JavaScript engines do not all round
 * Math.exp, Math.pow and friends alike in the last bit (Node and Chromium differ), and an
 * adaptive integration can carry such a bit to ~1e-8 in derived outputs like α_s. The default
 * integration tolerance, 1e-6, bounds what a rounding difference can do.
 */
export const ROUNDING_LIMIT = 1e-6;

export type Agreement = { kind: 'identical' | 'both empty' } | { kind: 'rounding' | 'differs'; relative: number | null };

/** How a recomputed value compares with the stored one. */
export function agreement(stored: number | null, recomputed: number | null): Agreement {
  if (stored === null && recomputed === null) return { kind: 'both empty' };
  if (stored === null || recomputed === null) return { kind: 'differs', relative: null };
  if (Object.is(stored, recomputed)) return { kind: 'identical' };
  const relative = Math.abs(stored - recomputed) / Math.max(Math.abs(stored), Math.abs(recomputed));
  return { kind: relative <= ROUNDING_LIMIT ? 'rounding' : 'differs', relative };
}

function Verdict({ verdict }: { verdict: Agreement }) {
  if (verdict.kind === 'both empty') {
    return (
      <Text as="span" color="fg.subtle" fontSize="sm">
        none in either
      </Text>
    );
  }
  const palette = { identical: 'green', rounding: 'yellow', differs: 'red' }[verdict.kind];
  const by = 'relative' in verdict && verdict.relative !== null ? ` by ${verdict.relative.toExponential(1)}` : '';
  return (
    <Badge colorPalette={palette} variant="subtle" size="sm" fontFamily={by ? 'mono' : undefined}>
      {verdict.kind === 'identical' ? 'identical' : verdict.kind === 'rounding' ? `rounding${by}` : `differs${by}`}
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
              {stored && recomputed && <Verdict verdict={stored.status === recomputed.status ? { kind: 'identical' } : { kind: 'differs', relative: null }} />}
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
