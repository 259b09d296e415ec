import { HStack, Text, type StackProps } from '@chakra-ui/react';

/** The Sixtyfold mark: a field resting on a flat plateau before it rolls down to the minimum. */
export function SixtyfoldMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="7" fill="#1a234f" />
      <path d="M4 12.5h8.5c4.5 0 5.5 12 10 12 2.3 0 3.8-1.8 5-4" fill="none" stroke="#fb972f" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
      <circle cx="8" cy="8.6" r="2.6" fill="#ffd09e" />
    </svg>
  );
}

interface WordmarkProps extends StackProps {
  size?: 'md' | 'lg';
  tone?: 'light' | 'dark';
}

export function Wordmark({ size = 'md', tone = 'light', ...props }: WordmarkProps) {
  const large = size === 'lg';
  return (
    <HStack gap={large ? '3' : '2.5'} {...props}>
      <SixtyfoldMark size={large ? 40 : 28} />
      <Text
        as="span"
        fontSize={large ? '2xl' : 'lg'}
        fontWeight="600"
        letterSpacing="-0.01em"
        color={tone === 'light' ? 'chrome.fg' : 'ink.900'}
      >
        Sixty<Text as="span" color={tone === 'light' ? 'chrome.accent' : 'ember.600'}>fold</Text>
      </Text>
    </HStack>
  );
}
