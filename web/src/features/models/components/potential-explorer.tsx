import { Box, Button, Field, Flex, Heading, Input, NativeSelect, Stack, Text } from '@chakra-ui/react';
import { scanMethodSchema, type CompiledPotential, type EvaluateRequest, type PotentialFamily, type PotentialModel, type ScanMethod } from '@sixtyfold/shared';
import { useMutation } from '@tanstack/react-query';
import { useDeferredValue, useEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import { FailureAlert } from '@/components/ui/failure-alert';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { runEnginePoint } from '@/lib/engine/run-engine';
import { formatNumber } from '@/lib/format-number';
import { defaultValueTexts, readNumber, readValues } from '../utils/parameter-values';
import { parsePotentialOnce } from '../utils/parse-cache';
import { defaultPhiRange } from '../utils/slow-roll-curves';
import { ParameterFields } from './parameter-fields';
import { PotentialPlot } from './potential-plot';
import { TrialResults } from './trial-results';
import { MethodOptions } from '@/components/ui/method-options';

/** A built-in family (the engine picks its start) or a group's model (the start is φ_init). */
export type ExplorerSubject = { kind: 'family'; family: PotentialFamily } | { kind: 'model'; model: PotentialModel };

const DEFAULT_N_STAR = 55;

type RangeTexts = { min: string; max: string };

// Where the plot opens: the start to the end of slow roll, or a plain window when neither is known.
function suggestedRange(potential: CompiledPotential | null, start: number | undefined): RangeTexts {
  if (!potential || start === undefined) return { min: '0', max: '10' };
  const { min, max } = defaultPhiRange(potential, start);
  return { min: String(min), max: String(max) };
}

/**
 * The potential for chosen parameter values: V(φ) with its slow-roll parameters, and one point
 * run by the engine in the browser. Both follow the same parameter fields.
 */
export function PotentialExplorer({ subject }: { subject: ExplorerSubject }) {
  const { expression, parameters } = subject.kind === 'family' ? subject.family : subject.model;
  const names = parameters.map((p) => p.name);
  const namesKey = names.join(',');
  // Parsing waits one render: the first one only posts the trial, so the engine's worker, which
  // parses too, starts at once and both parse side by side. names is a new array each render;
  // namesKey stands for it in the dependencies.
  const parseNow = useDeferredValue(true, false);
  const parsed = useMemo(() => (parseNow ? parsePotentialOnce(expression, names) : null), [parseNow, expression, namesKey]);

  const [texts, setTexts] = useState(() => defaultValueTexts(parameters));
  const read = readValues(parameters, texts);
  const valuesKey = read.ok ? JSON.stringify(read.values) : '';
  // valuesKey stands for read.values, which is a new object each render.
  const bound = useMemo(() => (parsed?.ok && read.ok ? parsed.potential.bind(read.values) : null), [parsed, valuesKey]);
  const potential = bound?.ok ? bound.potential : null;

  const [phiInitText, setPhiInitText] = useState(() =>
    subject.kind === 'model' && subject.model.phiInit !== null ? String(subject.model.phiInit) : '',
  );
  const family = subject.kind === 'family' ? subject.family : null;
  const start = useMemo(() => {
    if (!family) return readNumber(phiInitText) ?? undefined;
    if (!potential || !read.ok) return undefined;
    const phi = family.phiInit(read.values, potential);
    return Number.isFinite(phi) ? phi : undefined;
    // valuesKey stands for read.values; potential changes with it.
  }, [family, potential, phiInitText, valuesKey]);

  // The range follows the start and the end of slow roll until the user types one of their own.
  const [ownRange, setOwnRange] = useState<RangeTexts | null>(null);
  const suggested = useMemo(() => suggestedRange(potential, start), [potential, start]);
  const range = ownRange ?? suggested;
  const phiMin = readNumber(range.min);
  const phiMax = readNumber(range.max);
  const rangeError =
    phiMin === null ? 'Enter a number for φ min' : phiMax === null ? 'Enter a number for φ max' : phiMax <= phiMin ? 'φ max must be larger than φ min' : null;

  const [nStarText, setNStarText] = useState(String(DEFAULT_N_STAR));
  const [method, setMethod] = useState<ScanMethod>('slowroll');
  const nStar = readNumber(nStarText);
  const nStarError = nStar === null || nStar <= 0 || nStar > 1000 ? 'N_* is a number of e-folds between 0 and 1000, e.g. 55' : null;
  const phiInitError = subject.kind === 'model' && start === undefined ? 'Enter where the field starts, e.g. 7.5' : null;

  const request: EvaluateRequest | null =
    read.ok && nStar !== null && !nStarError && !phiInitError
      ? {
          potential: subject.kind === 'family' ? subject.family.key : subject.model.expression,
          params: read.values,
          // A family's start comes from the engine; a model starts where the user says.
          phiInit: subject.kind === 'model' ? start : undefined,
          nStar,
          method,
          trajectory: true,
        }
      : null;

  const trial = useMutation({ mutationFn: runEnginePoint });
  const stale = trial.variables !== undefined && JSON.stringify(trial.variables) !== JSON.stringify(request);

  // The defaults are evaluated once on arrival: the page opens with an answer, and the engine has
  // parsed the potential by the time the user asks for another point.
  const ranOnArrival = useRef(false);
  useEffect(() => {
    if (ranOnArrival.current) return;
    ranOnArrival.current = true;
    if (request) trial.mutate(request);
  }, [request, trial]);

  const runTrial = (event: FormEvent) => {
    event.preventDefault();
    if (request) trial.mutate(request);
  };

  return (
    <Stack gap="8">
      <Box as="section" aria-labelledby="explorer-values">
        <Heading as="h2" id="explorer-values" size="lg" color="ink.900" mb="1">
          Parameter values
        </Heading>
        <Text color="fg.muted" fontSize="sm" mb="3">
          The plot and the trial below use these values; they start at the defaults.
        </Text>
        <Panel p={{ base: '4', md: '5' }}>
          <Stack gap="4">
            <ParameterFields
              parameters={parameters}
              texts={texts}
              errors={read.ok ? {} : read.errors}
              onChange={(name, text) => setTexts((current) => ({ ...current, [name]: text }))}
            />
            {subject.kind === 'model' ? (
              <Field.Root invalid={phiInitError !== null} maxW={{ base: 'full', sm: '64' }}>
                <Field.Label>φ_init</Field.Label>
                <Input
                  value={phiInitText}
                  onChange={(event) => setPhiInitText(event.target.value)}
                  inputMode="decimal"
                  autoComplete="off"
                  fontFamily="mono"
                  bg="bg.panel"
                />
                {phiInitError ? (
                  <Field.ErrorText>{phiInitError}</Field.ErrorText>
                ) : (
                  <Field.HelperText>Where the field starts, on the slow-roll attractor.</Field.HelperText>
                )}
              </Field.Root>
            ) : (
              <Text fontSize="sm" color="fg.muted">
                The engine starts this family about 75 slow-roll e-folds before the end of inflation
                {start !== undefined && (
                  <>
                    , here at φ_init ≈{' '}
                    <Text as="span" fontFamily="mono">
                      {formatNumber(start, 5, 'power')}
                    </Text>
                  </>
                )}
                .
              </Text>
            )}
            {parameters.length > 0 && (
              <Button
                size="sm"
                variant="outline"
                alignSelf="start"
                onClick={() => {
                  setTexts(defaultValueTexts(parameters));
                }}
              >
                Reset to defaults
              </Button>
            )}
          </Stack>
        </Panel>
      </Box>

      {parsed && !parsed.ok ? (
        <FailureAlert title="The engine cannot read this expression">{parsed.problem.message}</FailureAlert>
      ) : (
        bound &&
        !bound.ok && (
          <FailureAlert title="These parameter values do not fit the expression">{bound.problem.message}</FailureAlert>
        )
      )}

      <Box as="section" aria-labelledby="explorer-plot">
        <Heading as="h2" id="explorer-plot" size="lg" color="ink.900" mb="1">
          Potential and slow roll
        </Heading>
        <Text color="fg.muted" fontSize="sm" mb="3">
          ε_V = ½(V′/V)² and η_V = V″/V from the potential alone (Liddle, Parsons &amp; Barrow 1994); slow roll holds while both are
          small and ends near ε_V = 1.
        </Text>
        <Panel p={{ base: '3', md: '5' }}>
          {parsed === null ? (
            <LoadingState label="Preparing the potential…" />
          ) : (
            <Stack gap="4">
              <Flex gap="3" align={{ base: 'stretch', sm: 'end' }} direction={{ base: 'column', sm: 'row' }} wrap="wrap">
                <Field.Root invalid={phiMin === null || rangeError?.includes('larger') === true} maxW={{ sm: '40' }}>
                  <Field.Label>φ min</Field.Label>
                  <Input
                    value={range.min}
                    onChange={(event) => setOwnRange({ ...range, min: event.target.value })}
                    inputMode="decimal"
                    autoComplete="off"
                    fontFamily="mono"
                    bg="bg.panel"
                  />
                </Field.Root>
                <Field.Root invalid={phiMax === null || rangeError?.includes('larger') === true} maxW={{ sm: '40' }}>
                  <Field.Label>φ max</Field.Label>
                  <Input
                    value={range.max}
                    onChange={(event) => setOwnRange({ ...range, max: event.target.value })}
                    inputMode="decimal"
                    autoComplete="off"
                    fontFamily="mono"
                    bg="bg.panel"
                  />
                </Field.Root>
                <Button variant="outline" onClick={() => setOwnRange(null)} disabled={ownRange === null}>
                  Fit range to the roll
                </Button>
              </Flex>
              {rangeError && (
                <Text color="fg.error" fontSize="sm" role="alert">
                  {rangeError}
                </Text>
              )}
              {potential && !rangeError && phiMin !== null && phiMax !== null ? (
                <PotentialPlot potential={potential} phiMin={phiMin} phiMax={phiMax} phiStart={start} />
              ) : (
                !rangeError && (
                  <Text color="fg.muted" fontSize="sm">
                    The plot appears once every parameter has a number.
                  </Text>
                )
              )}
            </Stack>
          )}
        </Panel>
      </Box>

      <Box as="section" aria-labelledby="explorer-trial">
        <Heading as="h2" id="explorer-trial" size="lg" color="ink.900" mb="1">
          Trial point
        </Heading>
        <Text color="fg.muted" fontSize="sm" mb="3">
          The scan engine runs here in your browser: background to the end of inflation, the pivot N_* e-folds before it, and the
          observables there.
        </Text>
        <Panel p={{ base: '4', md: '5' }}>
          <Stack gap="5">
            <form onSubmit={runTrial} aria-label="Trial point" noValidate>
              <Flex gap="4" align={{ base: 'stretch', md: 'start' }} direction={{ base: 'column', md: 'row' }}>
                <Field.Root invalid={nStarError !== null} maxW={{ md: '48' }}>
                  <Field.Label>N_*</Field.Label>
                  <Input
                    value={nStarText}
                    onChange={(event) => setNStarText(event.target.value)}
                    inputMode="decimal"
                    autoComplete="off"
                    fontFamily="mono"
                    bg="bg.panel"
                  />
                  {nStarError ? (
                    <Field.ErrorText>{nStarError}</Field.ErrorText>
                  ) : (
                    <Field.HelperText>e-folds from the pivot crossing to the end</Field.HelperText>
                  )}
                </Field.Root>
                <Field.Root maxW={{ md: '64' }}>
                  <Field.Label>Method</Field.Label>
                  <NativeSelect.Root>
                    <NativeSelect.Field value={method} onChange={(event) => setMethod(scanMethodSchema.parse(event.target.value))} bg="bg.panel">
                      <MethodOptions />
                    </NativeSelect.Field>
                    <NativeSelect.Indicator />
                  </NativeSelect.Root>
                </Field.Root>
                <Button
                  type="submit"
                  colorPalette="ember"
                  mt={{ md: '6' }}
                  disabled={!request}
                  loading={trial.isPending}
                  loadingText="Running…"
                  flexShrink="0"
                >
                  Run trial
                </Button>
              </Flex>
            </form>
            {trial.isPending && !trial.data && (
              <Text color="fg.muted" fontSize="sm" role="status">
                Integrating the background…
              </Text>
            )}
            {trial.isError && (
              <FailureAlert title="The trial did not run">
                    {trial.error.message.replace(/[.\s]*$/, '.')} Reload the page to restart the engine, then try again.
                  </FailureAlert>
            )}
            {trial.data && (
              <Stack gap="3">
                {stale && !trial.isPending && (
                  <Text fontSize="sm" color="ember.fg">
                    The inputs have changed since this run; run the trial again to update it.
                  </Text>
                )}
                <TrialResults result={trial.data} />
              </Stack>
            )}
          </Stack>
        </Panel>
      </Box>
    </Stack>
  );
}
