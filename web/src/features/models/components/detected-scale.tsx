import { Text } from '@chakra-ui/react';
import type { ModelParameter } from '@sixtyfold/shared';
import { useDeferredValue, useMemo } from 'react';
import { parsePotentialOnce } from '../utils/parse-cache';
import { ScaleStatement, ScaleStatementPending } from './scale-statement';

/**
 * The scale parameter the engine detects in a model's expression, found here in the browser with
 * the same parse the explorer uses (and caches), so the page says what the engine will do.
 */
export function DetectedScale({ expression, parameters }: { expression: string; parameters: ModelParameter[] }) {
  // Parsing waits one render, as in the explorer, so the rest of the page shows first.
  const parseNow = useDeferredValue(true, false);
  const parsed = useMemo(() => (parseNow ? parsePotentialOnce(expression, parameters.map((p) => p.name)) : null), [parseNow, expression, parameters]);
  if (!parsed) return <ScaleStatementPending />;
  if (!parsed.ok) {
    return (
      <Text as="span" color="fg.muted">
        not known: the expression does not parse ({parsed.problem.message})
      </Text>
    );
  }
  return <ScaleStatement scale={parsed.potential.scale} />;
}
