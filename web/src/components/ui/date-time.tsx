import { chakra, Text, type HTMLChakraProps } from '@chakra-ui/react';

const formatter = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** A timestamp from the API, in the reader's locale, with the exact ISO value on hover. */
export function DateTime({ iso, ...props }: HTMLChakraProps<'time'> & { iso: string | null }) {
  if (!iso) {
    return (
      <Text as="span" color="fg.subtle">
        —
      </Text>
    );
  }
  const date = new Date(iso);
  return (
    <chakra.time dateTime={iso} title={iso} whiteSpace="nowrap" {...props}>
      {Number.isNaN(date.getTime()) ? iso : formatter.format(date)}
    </chakra.time>
  );
}
