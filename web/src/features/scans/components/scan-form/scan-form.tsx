import { Button, Field, Fieldset, Input, NativeSelect, SegmentGroup, SimpleGrid, Stack, Textarea } from '@chakra-ui/react';
import { createScanSchema, POINTS_CSV_MAX_BYTES, type CreateScan, type PointList, type PotentialModel, type ScanDetail } from '@sixtyfold/shared';
import { useMemo, useRef, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { errorAdvice } from '@/components/ui/error-state';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { useCreateScan } from '../../api/create-scan';
import { useUploadScan } from '../../api/upload-scan';
import { pointsFileOf, readPointsFile, type PointsFileRead } from '../../utils/read-points-file';
import { AxisFields } from './axis-fields';
import { LaunchSummary, type WorkerSlots } from './launch-summary';
import { PivotMethodFields } from './pivot-method-fields';
import { PotentialFields } from './potential-fields';
import { chosenModel, nextAxis, syncFixedValues, withAxisParameter, withGroup, withModel } from './scan-form-edits';
import { countPoints, fileColumns, firstMessage, MAX_AXES, scanFormResolver, toNumber, toScanInput, type ScanFormContext, type ScanFormValues } from './scan-form-values';
import { useRunEstimate } from './use-run-estimate';

export interface LaunchGroup {
  id: number;
  name: string;
}

interface ScanFormProps {
  /** Groups where I may launch scans. */
  groups: LaunchGroup[];
  /** Group models; the form offers those of the chosen group. */
  models: PotentialModel[];
  initialValues: ScanFormValues;
  /** The points of a copied list scan, which the form starts with as if chosen from a file. */
  initialPoints?: PointList;
  /** Total concurrency of the live workers, for the run-time estimate. */
  workerSlots: WorkerSlots;
  onLaunched: (scan: ScanDetail) => void;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

type ChosenFile = { file: File; text: string };

/** The chosen file read with the API's own reader, against the model's parameters (its allowed columns). */
const readChosenFile = (chosen: ChosenFile | null, parameters: { name: string }[]) => (chosen ? readPointsFile(chosen.text, parameters.map((p) => p.name)) : null);

/** What the scan varies: the points file's columns, or the grid's axes. */
const variedBy = (values: Pick<ScanFormValues, 'points' | 'axes'>, pointsFile: PointsFileRead | null) =>
  values.points === 'file' ? fileColumns(pointsFile) : values.axes.map((axis) => axis.parameter);

export function ScanForm({ groups, models, initialValues, initialPoints, workerSlots, onLaunched }: ScanFormProps) {
  // One object for the form's lifetime, so the resolver always sees the file read last.
  const context = useRef<ScanFormContext>({ pointsFile: null });
  const {
    register,
    control,
    handleSubmit,
    getValues,
    setValue,
    setError,
    trigger,
    formState: { errors, isSubmitted },
  } = useForm<ScanFormValues, ScanFormContext, CreateScan>({ resolver: scanFormResolver, defaultValues: initialValues, context: context.current });
  const axisArray = useFieldArray({ control, name: 'axes' });
  const values = useWatch({ control }) as ScanFormValues;
  const addAxisButton = useRef<HTMLButtonElement>(null);
  const launch = useCreateScan({ onSuccess: onLaunched });
  const upload = useUploadScan({ onSuccess: onLaunched });
  const fromFile = values.points === 'file';
  const submission = fromFile ? upload : launch;

  const groupModels = models.filter((m) => m.groupId === values.groupId);
  const model = chosenModel(values.model, models);
  const parameters = model?.parameters ?? [];
  // The file is read here with the API's own reader, again when the model (its allowed columns) changes.
  const [chosenFile, setChosenFile] = useState<ChosenFile | null>(() =>
    initialPoints ? pointsFileOf(initialPoints, initialValues.pointsFile) : null,
  );
  const parameterNames = parameters.map((p) => p.name).join(',');
  const pointsFile = useMemo(() => readChosenFile(chosenFile, parameters), [chosenFile, parameterNames]);
  context.current.pointsFile = pointsFile;
  const onAxis = new Set(variedBy(values, pointsFile));
  const fixedParameters = parameters.filter((p) => !onAxis.has(p.name));
  const variedNote = (what: string) => (onAxis.has(what) ? (fromFile ? 'from the points file.' : 'on an axis.') : null);

  // The same check as the submit button, on every edit, so the summary only times a valid scan.
  const { input, problems } = toScanInput(values, pointsFile);
  const parsed = createScanSchema.safeParse(input);
  const spec = parsed.success && model && Object.keys(problems).length === 0 ? { ...parsed.data, phiInit: parsed.data.phiInit ?? model.phiInit ?? undefined } : null;
  const estimate = useRunEstimate(spec, model?.source ?? null);

  /**
   * Writes back what a change implies elsewhere (fixed values, axes), field by field so no input
   * remounts. A change of what is varied (grid or file, another file, a model that reads the file
   * otherwise) frees what left the axes or columns, with its default back, and fixes nothing varied.
   */
  const apply = (edited: ScanFormValues, nextChosenFile = chosenFile) => {
    const current = getValues();
    const nextParameters = chosenModel(edited.model, models)?.parameters ?? [];
    const nextFile = nextChosenFile === chosenFile && edited.model === current.model ? pointsFile : readChosenFile(nextChosenFile, nextParameters);
    const before = variedBy(current, pointsFile);
    const after = variedBy(edited, nextFile);
    const next = same(before, after) ? edited : { ...edited, ...syncFixedValues({ ...edited, axes: after.map((parameter) => ({ parameter })) }, before, nextParameters) };
    // The resolver reads the file from the context: the new one before any check below.
    context.current.pointsFile = nextFile;
    for (const key of Object.keys(next) as (keyof ScanFormValues)[]) {
      if (key === 'axes') {
        next.axes.forEach((axis, i) => !same(axis, current.axes[i]) && setValue(`axes.${i}`, axis));
      } else if (!same(next[key], current[key])) {
        setValue(key, next[key]);
      }
    }
    // After a failed launch, errors follow the edits; before it, the form stays quiet.
    if (isSubmitted) void trigger();
  };
  const syncAfterAxes = (before: string[]) => apply({ ...getValues(), ...syncFixedValues(getValues(), before, parameters) });
  const axisNames = () => getValues('axes').map((a) => a.parameter);

  const addAxis = () => {
    const before = axisNames();
    axisArray.append(nextAxis(parameters, getValues('axes')));
    syncAfterAxes(before);
  };
  const removeAxis = (index: number) => {
    const before = axisNames();
    axisArray.remove(index);
    syncAfterAxes(before);
    addAxisButton.current?.focus();
  };

  const onError = (error: Error) => {
    // A refused file (a line, a column) comes without fields.
    if (fromFile && isFieldRefusal(error) && Object.keys(error.fieldErrors).length === 0) {
      setError('pointsFile', { type: 'server', message: error.message });
    }
    // The API checks with the same schema and more (the model, the point limit): show its words where
    // they belong, the point list's beside the file.
    applyFieldErrors(error, setError, (field) => (field.startsWith('pointList') ? 'pointsFile' : field));
  };
  const onSubmit = handleSubmit((scan) =>
    fromFile && chosenFile ? upload.mutate({ spec: scan, file: chosenFile.file }, { onError }) : launch.mutate(scan, { onError }),
  );

  const chooseFile = async (file: File | undefined) => {
    const chosen = file ? { file, text: await file.text() } : null;
    setChosenFile(chosen);
    apply({ ...getValues(), pointsFile: file?.name ?? '' }, chosen);
  };

  const refused = isFieldRefusal(submission.error);
  const fileProblem = pointsFile && !pointsFile.ok ? pointsFile.message : errors.pointsFile?.message;
  const axesError = errors.axes?.message ?? errors.axes?.root?.message;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New scan">
      <Stack gap="8">
        <Fieldset.Root>
          <Fieldset.Legend fontSize="md" fontWeight="600" color="ink.900" mb="3">
            The scan
          </Fieldset.Legend>
          <Stack gap="4">
            <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
              <Field.Root invalid={!!errors.groupId}>
                <Field.Label>Group</Field.Label>
                <NativeSelect.Root>
                  <NativeSelect.Field
                    bg="bg.panel"
                    {...register('groupId', { setValueAs: toNumber })}
                    value={values.groupId ?? ''}
                    onChange={(event) => apply(withGroup(getValues(), Number(event.target.value), models))}
                  >
                    {groups.map((g) => (
                      <option key={g.id} value={g.id}>
                        {g.name}
                      </option>
                    ))}
                  </NativeSelect.Field>
                  <NativeSelect.Indicator />
                </NativeSelect.Root>
                <Field.ErrorText>{errors.groupId?.message}</Field.ErrorText>
              </Field.Root>
              <Field.Root invalid={!!errors.name}>
                <Field.Label>Name</Field.Label>
                <Input bg="bg.panel" autoComplete="off" placeholder="e.g. T-model, α from 0.1 to 10" {...register('name')} />
                <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
              </Field.Root>
            </SimpleGrid>
            <Field.Root invalid={!!errors.tags}>
              <Field.Label>Tags</Field.Label>
              <Input bg="bg.panel" autoComplete="off" placeholder="plateau, draft" {...register('tags')} />
              <Field.HelperText>Separated by commas; the scans list can filter by them.</Field.HelperText>
              <Field.ErrorText>{firstMessage(errors.tags)}</Field.ErrorText>
            </Field.Root>
            <Field.Root invalid={!!errors.note}>
              <Field.Label>Note</Field.Label>
              <Textarea bg="bg.panel" rows={2} placeholder="What this scan is for" {...register('note')} />
              <Field.ErrorText>{errors.note?.message}</Field.ErrorText>
            </Field.Root>
          </Stack>
        </Fieldset.Root>

        <PotentialFields
          register={register}
          errors={errors}
          modelKey={values.model}
          model={model}
          groupModels={groupModels}
          groupName={groups.find((g) => g.id === values.groupId)?.name ?? 'this group'}
          fixedParameters={fixedParameters}
          onModelChange={(modelKey) => apply(withModel(getValues(), modelKey, models))}
        />

        <Fieldset.Root invalid={fromFile ? !!fileProblem : !!axesError}>
          <Fieldset.Legend fontSize="md" fontWeight="600" color="ink.900">
            Points
          </Fieldset.Legend>
          <SegmentGroup.Root
            size="sm"
            my="3"
            value={values.points}
            onValueChange={(details) => apply({ ...getValues(), points: details.value === 'file' ? 'file' : 'grid' })}
            aria-label="Where the points come from"
          >
            <SegmentGroup.Indicator />
            <SegmentGroup.Items items={[{ value: 'grid', label: 'Grid' }, { value: 'file', label: 'Points from a file' }]} />
          </SegmentGroup.Root>
          {fromFile ? (
            <Field.Root invalid={!!fileProblem}>
              <Field.Label>Points file (.csv, at most {POINTS_CSV_MAX_BYTES / 1024 / 1024} MB)</Field.Label>
              <Input type="file" accept=".csv,text/csv" p="1" onChange={(event) => void chooseFile(event.target.files?.[0])} />
              <Field.HelperText>
                {pointsFile?.ok
                  ? `${pointsFile.pointList.rows.length.toLocaleString('en-US')} points from ${values.pointsFile}, columns ${pointsFile.pointList.columns.join(', ')}`
                  : 'A header naming the varied parameters (and nStar, reheatingW or reheatingEnergyGeV), then one point per line.'}
              </Field.HelperText>
              <Field.ErrorText>{fileProblem}</Field.ErrorText>
            </Field.Root>
          ) : (
            <>
              <Fieldset.HelperText mb="3">
                Up to {MAX_AXES} axes. The grid is every combination of their values; the last axis runs fastest.
              </Fieldset.HelperText>
              <Stack gap="4">
                {axisArray.fields.map((field, index) => (
                  <AxisFields
                    key={field.id}
                    index={index}
                    kind={values.axes[index]?.kind ?? 'range'}
                    parameter={values.axes[index]?.parameter ?? ''}
                    parameters={parameters}
                    register={register}
                    errors={errors.axes?.[index]}
                    onParameterChange={(parameter) => apply(withAxisParameter(getValues(), index, parameter, parameters))}
                    onRemove={axisArray.fields.length > 1 ? () => removeAxis(index) : undefined}
                  />
                ))}
                {axesError && <Fieldset.ErrorText>{axesError}</Fieldset.ErrorText>}
                <Button
                  ref={addAxisButton}
                  alignSelf="start"
                  variant="outline"
                  size="sm"
                  onClick={addAxis}
                  disabled={axisArray.fields.length >= MAX_AXES}
                >
                  Add axis
                </Button>
              </Stack>
            </>
          )}
        </Fieldset.Root>

        <PivotMethodFields register={register} errors={errors} pivotKind={values.pivot.kind} method={values.method} variedNote={variedNote} />

        <LaunchSummary points={fromFile ? (pointsFile?.ok ? pointsFile.pointList.rows.length : null) : countPoints(values.axes)} estimate={estimate} workerSlots={workerSlots} />

        {submission.isError && (
          <FailureAlert title={refused ? 'The server refused this scan' : 'Could not launch the scan'}>
            {/[.!?]$/.test(submission.error.message) ? submission.error.message : `${submission.error.message}.`}{' '}
            {refused ? 'Correct the marked fields and launch again.' : errorAdvice(submission.error)}
          </FailureAlert>
        )}

        <Button type="submit" colorPalette="ember" alignSelf={{ base: 'stretch', sm: 'start' }} loading={submission.isPending} loadingText="Launching…">
          Launch scan
        </Button>
      </Stack>
    </form>
  );
}
