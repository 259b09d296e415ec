import { Box, type BoxProps } from '@chakra-ui/react';

/** The white, hairline-bordered surface that tables and detail blocks sit on. */
export function Panel(props: BoxProps) {
  return <Box bg="bg.panel" borderWidth="1px" borderColor="border" borderRadius="xl" boxShadow="xs" overflow="hidden" {...props} />;
}
