import { Box, Stack, Text } from '@chakra-ui/react';
import { checkPotentialExpression } from '@sixtyfold/shared';
import { useEffect, useState } from 'react';
import { Formula } from '@/components/ui/formula';
import { parsePotentialOnce } from '../utils/parse-cache';

const CHECK_DELAY_MS = 300;

// Checking differentiates the expression three times, which can take a good fraction of a second,
// so it waits until typing pauses instead of running on every keystroke.
function useSettled(value: string, delayMs: number): string {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}

const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** The line of `source` holding the problem, and where on it the marker goes. */
function markedLine(source: string, index: number, length: number) {
  const lineStart = source.lastIndexOf('\n', index - 1) + 1;
  const lineEndAt = source.indexOf('\n', index);
  const lineEnd = lineEndAt === -1 ? source.length : lineEndAt;
  const column = index - lineStart;
  // A problem at the very end (a missing bracket) gets one marker just past the text.
  const span = Math.max(1, Math.min(length, lineEnd - index));
  return { before: source.slice(lineStart, index), marked: source.slice(index, index + span), after: source.slice(index + span, lineEnd), column, span };
}

interface ExpressionCheckProps {
  expression: string;
  parameterNames: string[];
  /** Id of the element that describes the textarea, so the verdict is read with it. */
  id: string;
  /** What the form or the API said about the expression on submit, shown unless the check already says it. */
  formError?: string;
}

/**
 * What the engine makes of the expression as it is typed: the problem with a marker under the
 * offending characters, or V′ as the engine will use it and the declared parameters it ignores.
 */
export function ExpressionCheck({ expression, parameterNames, id, formError }: ExpressionCheckProps) {
  const settled = useSettled(JSON.stringify([expression, parameterNames]), CHECK_DELAY_MS);
  const [source, names] = JSON.parse(settled) as [string, string[]];

  const submitted = formError && (
    <Text color="fg.error" fontSize="sm" fontWeight="500">
      {formError}
    </Text>
  );

  if (source.trim() === '') {
    return (
      <Stack id={id} gap="2">
        {submitted}
        <Text fontSize="sm" color="fg.muted">
          Write V in terms of the field phi and your parameters, e.g. <code>V0 * (1 - exp(-sqrt(2/3) * phi))^2</code>. Functions:
          sqrt, exp, log, sin, cos, tanh and the like; constants pi and e.
        </Text>
      </Stack>
    );
  }
  // Parameter rows still being filled in are not names yet; the form reports them itself.
  const declared = names.filter((name) => name.trim() !== '');
  const check = checkPotentialExpression(source, declared);

  if (!check.ok) {
    const marker = check.index !== undefined ? markedLine(source, check.index, check.length ?? 1) : null;
    const message = sentence(check.message);
    return (
      <Stack id={id} gap="2" aria-live="polite">
        {formError !== message && submitted}
        <Text color="fg.error" fontSize="sm" fontWeight="500">
          {message}
        </Text>
        {marker && (
          <Box
            as="pre"
            fontFamily="mono"
            fontSize="sm"
            bg="red.50"
            borderRadius="md"
            px="3"
            py="2"
            overflowX="auto"
            aria-hidden="true"
            data-testid="expression-marker"
          >
            {marker.before}
            <Box as="mark" bg="red.200" color="red.900" borderRadius="xs">
              {marker.marked}
            </Box>
            {marker.after}
            {'\n'}
            <Box as="span" color="red.600">
              {' '.repeat(marker.column)}
              {'^'.repeat(marker.span)}
            </Box>
          </Box>
        )}
      </Stack>
    );
  }

  const parsed = parsePotentialOnce(source, declared);
  const unused = declared.filter((name) => !check.usedParameters.includes(name));
  return (
    <Stack id={id} gap="2" aria-live="polite">
      {submitted}
      <Text color="green.700" fontSize="sm" fontWeight="500">
        The engine reads this potential.
      </Text>
      <Box fontSize="sm" color="fg.muted">
        <Text mb="1">{parsed.ok ? 'Read as V, with the derivative the engine will use:' : 'Read as:'}</Text>
        <Stack gap="1" bg="dust.50" borderRadius="md" px="3" py="2" borderWidth="1px" borderColor="border.muted">
          <Formula expression={source} lhs="V(\phi) =" block />
          {parsed.ok && <Formula expression={parsed.potential.derivatives.dV} lhs="V'(\phi) =" block />}
        </Stack>
      </Box>
      {unused.length > 0 && (
        <Text color="ember.fg" fontSize="sm">
          Declared but not used:{' '}
          <Text as="span" fontFamily="mono">
            {unused.join(', ')}
          </Text>
          . Scans could vary {unused.length === 1 ? 'it' : 'them'} without changing anything.
        </Text>
      )}
    </Stack>
  );
}
