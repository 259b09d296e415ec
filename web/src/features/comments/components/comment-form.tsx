import { Box, Button, Field, HStack, Stack, Text, Textarea } from '@chakra-ui/react';
import { zodResolver } from '@hookform/resolvers/zod';
import { commentBodySchema, COMMENT_BODY_MAX, type CommentBody, type CommentPerson } from '@sixtyfold/shared';
import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { useForm } from 'react-hook-form';
import { FailureAlert } from '@/components/ui/failure-alert';
import { applyFieldErrors, isFieldRefusal } from '@/lib/form-errors';
import { insertMention, matchingPeople, mentionQueryAt, type MentionQuery } from '../utils/mentions';

interface CommentFormProps {
  /** The textarea's label: what is being written. */
  label: string;
  submitLabel: string;
  busyLabel: string;
  defaultBody?: string;
  /** Who `@` offers: the scan's group members. */
  people: CommentPerson[];
  /** Saves the body; the form empties itself afterwards when `resetOnSuccess`. */
  onSubmit: (values: CommentBody) => Promise<unknown>;
  resetOnSuccess?: boolean;
  onCancel?: () => void;
}

/**
 * A comment's text with `@handle` completion: typing "@" and letters lists the group members whose
 * handle starts with them, under the textarea. Arrows move, Enter or Tab insert, Escape closes.
 */
export function CommentForm({ label, submitLabel, busyLabel, defaultBody = '', people, onSubmit, resetOnSuccess = false, onCancel }: CommentFormProps) {
  const {
    register,
    handleSubmit,
    reset,
    setError,
    setValue,
    formState: { errors, isSubmitting, isSubmitted },
  } = useForm<CommentBody>({ resolver: zodResolver(commentBodySchema), defaultValues: { body: defaultBody } });
  const [failure, setFailure] = useState<string | null>(null);
  const [query, setQuery] = useState<MentionQuery | null>(null);
  const [active, setActive] = useState(0);
  const textarea = useRef<HTMLTextAreaElement | null>(null);
  const listId = useId();
  const optionId = (i: number) => `${listId}-option-${i}`;

  const options = query ? matchingPeople(people, query.text) : [];
  const open = options.length > 0;
  const { ref, onChange, ...field } = register('body');

  // Re-read the word at the caret after every edit or caret move.
  const follow = () => {
    const el = textarea.current;
    const next = el && el.selectionStart === el.selectionEnd ? mentionQueryAt(el.value, el.selectionStart) : null;
    if (next?.start !== query?.start || next?.text !== query?.text) setActive(0);
    setQuery(next);
  };

  const choose = (person: CommentPerson) => {
    const el = textarea.current;
    if (!el || !query) return;
    const next = insertMention(el.value, el.selectionStart, query, person.handle);
    setValue('body', next.value, { shouldDirty: true, shouldValidate: isSubmitted });
    el.focus();
    el.setSelectionRange(next.caret, next.caret);
    setQuery(null);
  };

  const onKeyDown = (event: KeyboardEvent<HTMLTextAreaElement>) => {
    if (!open) return;
    if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      const step = event.key === 'ArrowDown' ? 1 : -1;
      setActive((i) => (i + step + options.length) % options.length);
    } else if (event.key === 'Enter' || event.key === 'Tab') {
      event.preventDefault();
      choose(options[Math.min(active, options.length - 1)]);
    } else if (event.key === 'Escape') {
      // Closes the list only, not a drawer or dialog around the form.
      event.preventDefault();
      event.stopPropagation();
      setQuery(null);
    }
  };

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await onSubmit(values);
      if (resetOnSuccess) reset({ body: '' });
    } catch (error) {
      if (isFieldRefusal(error) && error.fieldErrors.body) applyFieldErrors(error, setError);
      else setFailure(error instanceof Error ? error.message : 'Something went wrong.');
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label={label}>
      <Stack gap="3">
        {failure && (
          <FailureAlert title="Could not save the comment">{failure}</FailureAlert>
        )}
        <Field.Root invalid={!!errors.body}>
          <Field.Label>{label}</Field.Label>
          <Box position="relative" w="full">
            <Textarea
              {...field}
              ref={(element) => {
                ref(element);
                textarea.current = element;
              }}
              onChange={(event) => {
                void onChange(event);
                follow();
              }}
              onSelect={follow}
              onBlur={(event) => {
                void field.onBlur(event);
                setQuery(null);
              }}
              onKeyDown={onKeyDown}
              rows={3}
              maxLength={COMMENT_BODY_MAX}
              bg="bg.panel"
              aria-autocomplete="list"
              aria-controls={open ? listId : undefined}
              aria-activedescendant={open ? optionId(active) : undefined}
            />
            {open && (
              <Box
                as="ul"
                id={listId}
                role="listbox"
                aria-label="People to mention"
                position="absolute"
                top="100%"
                insetStart="0"
                mt="1"
                zIndex="popover"
                minW="64"
                maxH="60"
                overflowY="auto"
                bg="bg.panel"
                borderWidth="1px"
                borderColor="border"
                borderRadius="md"
                boxShadow="md"
                py="1"
                listStyleType="none"
              >
                {options.map((person, i) => (
                  <Box
                    as="li"
                    key={person.id}
                    id={optionId(i)}
                    role="option"
                    aria-selected={i === active}
                    px="3"
                    py="1.5"
                    cursor="pointer"
                    bg={i === active ? 'ember.subtle' : undefined}
                    // Keep the focus in the textarea, so the caret is where the handle goes.
                    onMouseDown={(event) => event.preventDefault()}
                    onMouseEnter={() => setActive(i)}
                    onClick={() => choose(person)}
                  >
                    <Text as="span" fontWeight="500" color="ink.900">
                      {person.displayName}
                    </Text>{' '}
                    <Text as="span" fontFamily="mono" fontSize="sm" color="fg.muted">
                      @{person.handle}
                    </Text>
                  </Box>
                ))}
              </Box>
            )}
          </Box>
          <Field.HelperText>Plain text. Type @ and a name to mention someone in the group; they are notified.</Field.HelperText>
          <Field.ErrorText>{errors.body?.message}</Field.ErrorText>
        </Field.Root>
        <HStack gap="2">
          <Button type="submit" size="sm" colorPalette="ember" loading={isSubmitting} loadingText={busyLabel}>
            {submitLabel}
          </Button>
          {onCancel && (
            <Button size="sm" variant="ghost" onClick={onCancel} disabled={isSubmitting}>
              Cancel
            </Button>
          )}
        </HStack>
      </Stack>
    </form>
  );
}
