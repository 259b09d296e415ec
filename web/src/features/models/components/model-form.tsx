import { Box, Button, Field, Grid, HStack, Heading, Input, NativeSelect, Stack, Text, Textarea, VisuallyHidden } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  modelInputSchema,
  modelUpdateSchema,
  type MembershipSummary,
  type ModelInput,
  type ModelUpdate,
  type PotentialModel,
} from '@sixtyfold/shared';
import {
  useFieldArray,
  useForm,
  useWatch,
  type FieldError,
  type FieldValues,
  type Resolver,
  type ResolverOptions,
  type ResolverResult,
} from 'react-hook-form';
import { Link as RouterLink } from 'react-router-dom';
import type { z } from 'zod';
import { FailureAlert } from '@/components/ui/failure-alert';
import { Panel } from '@/components/ui/panel';
import { applyFieldErrors } from '@/lib/form-errors';
import { useCreateModel } from '../api/create-model';
import { useUpdateModel } from '../api/update-model';
import { ExpressionCheck } from './expression-check';

/** The form holds what was typed; numbers become numbers just before the shared schema checks them. */
export interface ModelFormValues {
  groupId: string;
  name: string;
  expression: string;
  parameters: { name: string; defaultValue: string; min: string; max: string; description: string }[];
  phiInit: string;
  description: string;
}

const EMPTY_PARAMETER = { name: '', defaultValue: '', min: '', max: '', description: '' };

// An empty field is "not given"; anything else must read as a number, or the schema says it is not one.
const toNumber = (text: string): number | undefined => (text.trim() === '' ? undefined : Number(text.trim().replace('−', '-')));

function toBody(values: ModelFormValues) {
  return {
    name: values.name,
    expression: values.expression,
    parameters: values.parameters.map((p) => ({
      name: p.name.trim(),
      defaultValue: toNumber(p.defaultValue),
      min: toNumber(p.min),
      max: toNumber(p.max),
      description: p.description,
    })),
    phiInit: toNumber(values.phiInit),
    description: values.description,
  };
}

/**
 * The API validates with these same schemas; this only turns the typed text into numbers first.
 * The body may still hold undefined or NaN where a number belongs, and the schema says so.
 */
function schemaResolver<Output>(schema: z.ZodType<Output, FieldValues>, toBody: (values: ModelFormValues) => FieldValues) {
  const resolve = zodResolver(schema);
  const resolver: Resolver<ModelFormValues, unknown, Output> = (values, context, options) =>
    resolve(toBody(values), context, options as unknown as ResolverOptions<FieldValues>) as Promise<ResolverResult<ModelFormValues, Output>>;
  return resolver;
}

const createResolver = schemaResolver(modelInputSchema, (values) => ({ ...toBody(values), groupId: toNumber(values.groupId) }));
const updateResolver = schemaResolver(modelUpdateSchema, toBody);

function valuesOf(model: PotentialModel): ModelFormValues {
  const text = (value: number | undefined | null) => (value === undefined || value === null ? '' : String(value));
  return {
    groupId: String(model.groupId),
    name: model.name,
    expression: model.expression,
    parameters: model.parameters.map((p) => ({
      name: p.name,
      defaultValue: text(p.defaultValue),
      min: text(p.min),
      max: text(p.max),
      description: p.description,
    })),
    phiInit: text(model.phiInit),
    description: model.description,
  };
}

/** Schema messages start in lower case to read well after a field name; here they stand alone. */
function messageOf(error: FieldError | undefined, numeric = false): string | undefined {
  if (!error?.message) return undefined;
  if (numeric && error.type === 'invalid_type') return 'Enter a number, e.g. 1e-10';
  return error.message.charAt(0).toUpperCase() + error.message.slice(1);
}

type ModelFormProps =
  | { mode: 'create'; groups: MembershipSummary[]; groupId?: number; onSaved: (model: PotentialModel) => void; cancelHref: string }
  | { mode: 'edit'; model: PotentialModel; groupName: string; onSaved: (model: PotentialModel) => void; cancelHref: string };

/** Create or edit a group's potential model, checked by the schema the API uses. */
export function ModelForm(props: ModelFormProps) {
  const editing = props.mode === 'edit';
  const defaultValues: ModelFormValues = editing
    ? valuesOf(props.model)
    : {
        groupId: String(
          props.groups.find((g) => g.groupId === props.groupId)?.groupId ?? (props.groups.length === 1 ? props.groups[0].groupId : ''),
        ),
        name: '',
        expression: '',
        parameters: [{ ...EMPTY_PARAMETER }],
        phiInit: '',
        description: '',
      };

  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<ModelFormValues, unknown, ModelInput | ModelUpdate>({
    resolver: (editing ? updateResolver : createResolver) as Resolver<ModelFormValues, unknown, ModelInput | ModelUpdate>,
    defaultValues,
    // Each check of the expression parses it; after a failed submit, re-check on leaving a field, not on each keystroke.
    reValidateMode: 'onBlur',
  });
  const parameters = useFieldArray({ control, name: 'parameters' });
  const expression = useWatch({ control, name: 'expression' });
  const parameterNames = useWatch({ control, name: 'parameters' }).map((p) => p.name.trim());

  const create = useCreateModel({ onSuccess: props.onSaved });
  const update = useUpdateModel({ onSuccess: props.onSaved });
  const mutation = editing ? update : create;

  const showServerErrors = (error: Error) => applyFieldErrors(error, setError);

  const onSubmit = handleSubmit((body) => {
    if (props.mode === 'edit') update.mutate({ modelId: props.model.id, changes: body as ModelUpdate }, { onError: showServerErrors });
    else create.mutate(body as ModelInput, { onError: showServerErrors });
  });

  const expressionHelpId = 'model-expression-check';
  const parameterError = (i: number, key: 'name' | 'defaultValue' | 'min' | 'max' | 'description') =>
    messageOf(errors.parameters?.[i]?.[key], key === 'defaultValue' || key === 'min' || key === 'max');

  return (
    <form onSubmit={onSubmit} noValidate aria-label={editing ? 'Edit the model' : 'New model'}>
      <Stack gap="6">
        {mutation.isError && (
          <FailureAlert title={editing ? 'Could not save the model' : 'Could not create the model'}>{mutation.error.message}</FailureAlert>
        )}

        <Panel p={{ base: '4', md: '6' }}>
          <Stack gap="5">
            <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
              <Field.Root invalid={!!errors.groupId} flex="1" disabled={editing}>
                <Field.Label>Group</Field.Label>
                <NativeSelect.Root>
                  {/* defaultValue marks the chosen option in the DOM too, so the form never reads the select as edited before it is. */}
                  <NativeSelect.Field bg="bg.panel" defaultValue={defaultValues.groupId} {...register('groupId')}>
                    {props.mode === 'edit' ? (
                      <option value={String(props.model.groupId)}>{props.groupName}</option>
                    ) : (
                      <>
                        {props.groups.length !== 1 && <option value="">Choose a group</option>}
                        {props.groups.map((g) => (
                          <option key={g.groupId} value={String(g.groupId)}>
                            {g.groupName}
                          </option>
                        ))}
                      </>
                    )}
                  </NativeSelect.Field>
                  <NativeSelect.Indicator />
                </NativeSelect.Root>
                {errors.groupId ? (
                  <Field.ErrorText>{messageOf(errors.groupId)}</Field.ErrorText>
                ) : (
                  <Field.HelperText>{editing ? 'A model stays in its group.' : 'Everyone in the group can see and scan it.'}</Field.HelperText>
                )}
              </Field.Root>
              <Field.Root invalid={!!errors.name} flex="2">
                <Field.Label>Name</Field.Label>
                <Input bg="bg.panel" autoComplete="off" placeholder="e.g. Plateau with a bump" {...register('name')} />
                <Field.ErrorText>{messageOf(errors.name)}</Field.ErrorText>
              </Field.Root>
            </Stack>

            <Field.Root invalid={!!errors.expression}>
              <Field.Label>Expression V(φ)</Field.Label>
              <Textarea
                fontFamily="mono"
                fontSize="sm"
                rows={3}
                bg="bg.panel"
                spellCheck={false}
                autoComplete="off"
                autoCapitalize="off"
                placeholder="V0 * (1 - exp(-sqrt(2/3) * phi))^2"
                aria-describedby={expressionHelpId}
                {...register('expression')}
              />
              <Box w="full" mt="1">
                <ExpressionCheck
                  id={expressionHelpId}
                  expression={expression}
                  parameterNames={parameterNames}
                  formError={messageOf(errors.expression)}
                />
              </Box>
            </Field.Root>
          </Stack>
        </Panel>

        <Box as="section" aria-labelledby="model-form-parameters">
          <Heading as="h2" id="model-form-parameters" size="md" color="ink.900" mb="1">
            Parameters
          </Heading>
          <Text fontSize="sm" color="fg.muted" mb="3">
            Names the expression uses besides phi, with the default value and the range a scan offers at first.
          </Text>
          <Panel p={{ base: '4', md: '5' }}>
            <Stack gap="4">
              {typeof errors.parameters?.message === 'string' && (
                <Text color="fg.error" fontSize="sm">
                  {messageOf(errors.parameters as FieldError)}
                </Text>
              )}
              {parameters.fields.length === 0 && (
                <Text fontSize="sm" color="fg.muted">
                  No parameters: V depends on phi alone.
                </Text>
              )}
              {parameters.fields.map((field, i) => (
                <Grid
                  key={field.id}
                  role="group"
                  aria-label={`Parameter ${i + 1}`}
                  templateColumns={{ base: '1fr 1fr', md: '1.1fr 1fr 1fr 1fr 2fr auto' }}
                  gap="3"
                  alignItems="start"
                  pb={{ base: '4', md: '0' }}
                  borderBottomWidth={{ base: '1px', md: '0' }}
                  borderColor="border.muted"
                >
                  <Field.Root invalid={!!parameterError(i, 'name')}>
                    <Field.Label>
                      <VisuallyHidden>Parameter {i + 1} </VisuallyHidden>name
                    </Field.Label>
                    <Input fontFamily="mono" bg="bg.panel" autoComplete="off" spellCheck={false} {...register(`parameters.${i}.name`)} />
                    <Field.ErrorText>{parameterError(i, 'name')}</Field.ErrorText>
                  </Field.Root>
                  <Field.Root invalid={!!parameterError(i, 'defaultValue')}>
                    <Field.Label>
                      <VisuallyHidden>Parameter {i + 1} </VisuallyHidden>default
                    </Field.Label>
                    <Input fontFamily="mono" bg="bg.panel" inputMode="decimal" autoComplete="off" {...register(`parameters.${i}.defaultValue`)} />
                    <Field.ErrorText>{parameterError(i, 'defaultValue')}</Field.ErrorText>
                  </Field.Root>
                  <Field.Root invalid={!!parameterError(i, 'min')}>
                    <Field.Label>
                      <VisuallyHidden>Parameter {i + 1} </VisuallyHidden>min
                    </Field.Label>
                    <Input fontFamily="mono" bg="bg.panel" inputMode="decimal" autoComplete="off" placeholder="optional" {...register(`parameters.${i}.min`)} />
                    <Field.ErrorText>{parameterError(i, 'min')}</Field.ErrorText>
                  </Field.Root>
                  <Field.Root invalid={!!parameterError(i, 'max')}>
                    <Field.Label>
                      <VisuallyHidden>Parameter {i + 1} </VisuallyHidden>max
                    </Field.Label>
                    <Input fontFamily="mono" bg="bg.panel" inputMode="decimal" autoComplete="off" placeholder="optional" {...register(`parameters.${i}.max`)} />
                    <Field.ErrorText>{parameterError(i, 'max')}</Field.ErrorText>
                  </Field.Root>
                  <Field.Root invalid={!!parameterError(i, 'description')} gridColumn={{ base: 'span 2', md: 'auto' }}>
                    <Field.Label>
                      <VisuallyHidden>Parameter {i + 1} </VisuallyHidden>description
                    </Field.Label>
                    <Input bg="bg.panel" autoComplete="off" placeholder="what it means" {...register(`parameters.${i}.description`)} />
                    <Field.ErrorText>{parameterError(i, 'description')}</Field.ErrorText>
                  </Field.Root>
                  <Button
                    variant="ghost"
                    colorPalette="red"
                    size="sm"
                    mt={{ base: '0', md: '6' }}
                    gridColumn={{ base: 'span 2', md: 'auto' }}
                    justifySelf={{ base: 'start', md: 'auto' }}
                    onClick={() => parameters.remove(i)}
                    aria-label={`Remove parameter ${i + 1}`}
                  >
                    Remove
                  </Button>
                </Grid>
              ))}
              <Button variant="outline" size="sm" alignSelf="start" onClick={() => parameters.append({ ...EMPTY_PARAMETER })}>
                Add parameter
              </Button>
            </Stack>
          </Panel>
        </Box>

        <Panel p={{ base: '4', md: '6' }}>
          <Stack gap="5">
            <Field.Root invalid={!!errors.phiInit} maxW={{ md: 'xs' }}>
              <Field.Label>φ_init</Field.Label>
              <Input fontFamily="mono" bg="bg.panel" inputMode="decimal" autoComplete="off" placeholder="e.g. 7.5" {...register('phiInit')} />
              {errors.phiInit ? (
                <Field.ErrorText>{messageOf(errors.phiInit)}</Field.ErrorText>
              ) : (
                <Field.HelperText>Where the field starts rolling, in reduced Planck units, far enough up for N_* e-folds.</Field.HelperText>
              )}
            </Field.Root>
            <Field.Root invalid={!!errors.description}>
              <Field.Label>Description</Field.Label>
              <Textarea bg="bg.panel" rows={3} placeholder="What the model is for, and where it comes from" {...register('description')} />
              <Field.ErrorText>{messageOf(errors.description)}</Field.ErrorText>
            </Field.Root>
          </Stack>
        </Panel>

        <HStack gap="3">
          <Button type="submit" colorPalette="ember" loading={mutation.isPending} loadingText={editing ? 'Saving…' : 'Creating…'}>
            {editing ? 'Save changes' : 'Create model'}
          </Button>
          <Button asChild variant="ghost">
            <RouterLink to={props.cancelHref}>Cancel</RouterLink>
          </Button>
        </HStack>
      </Stack>
    </form>
  );
}
