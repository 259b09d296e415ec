import { Button, HStack, Text } from '@chakra-ui/react';

interface PagerProps {
  page: number;
  pageSize: number;
  total: number;
  noun: string;
  onPageChange: (page: number) => void;
  busy?: boolean;
}

/** Previous / next paging for the API's Page<T> envelope (pages count from 1). */
export function Pager({ page, pageSize, total, noun, onPageChange, busy }: PagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <HStack as="nav" aria-label={`${noun} pages`} justify="space-between" mt="4" gap="4" wrap="wrap">
      <Text color="fg.muted" fontSize="sm">
        Page <Text as="span" fontFamily="mono">{Math.min(page, pages)}</Text> of{' '}
        <Text as="span" fontFamily="mono">{pages}</Text> · <Text as="span" fontFamily="mono">{total}</Text> {noun}
      </Text>
      <HStack gap="2">
        <Button size="sm" variant="outline" disabled={page <= 1 || busy} onClick={() => onPageChange(page - 1)}>
          Previous
        </Button>
        <Button size="sm" variant="outline" disabled={page >= pages || busy} onClick={() => onPageChange(page + 1)}>
          Next
        </Button>
      </HStack>
    </HStack>
  );
}
