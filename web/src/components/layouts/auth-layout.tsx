import { Box, Flex, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

// A sparse field of "stars": radial gradients only, so there is no image to load.
const stars = [
  [8, 14, 1.5], [17, 41, 1], [23, 9, 1], [31, 27, 1.5], [44, 12, 1], [52, 47, 1], [61, 21, 1.5], [69, 6, 1],
  [76, 36, 1], [84, 15, 1.5], [91, 44, 1], [12, 58, 1], [38, 66, 1], [57, 71, 1], [88, 63, 1.5], [5, 83, 1],
  [27, 91, 1], [73, 88, 1], [95, 79, 1],
] as const;
const skyBackground = [
  ...stars.map(([x, y, r]) => `radial-gradient(${r}px ${r}px at ${x}% ${y}%, rgba(238,241,251,.8), transparent)`),
  'radial-gradient(90% 70% at 10% 110%, rgba(234,122,18,.30), transparent 60%)',
  'radial-gradient(60% 50% at 100% 0%, rgba(67,82,158,.35), transparent 70%)',
  'linear-gradient(165deg, #0a0e22 0%, #111735 55%, #1a234f 100%)',
].join(', ');

interface AuthLayoutProps {
  title: string;
  /** The line under the title. */
  intro?: ReactNode;
  children: ReactNode;
}

export function AuthLayout({ title, intro = 'Use the e-mail address of your Sixtyfold account.', children }: AuthLayoutProps) {
  return (
    <Flex minH="100dvh" direction={{ base: 'column', lg: 'row' }}>
      <Flex
        flex={{ base: 'none', lg: '1.15' }}
        bgImage={skyBackground}
        color="chrome.fg"
        direction="column"
        justify="space-between"
        px={{ base: '6', md: '12', xl: '16' }}
        py={{ base: '8', md: '12' }}
        gap={{ base: '6', lg: '10' }}
      >
        <Wordmark size="lg" />
        <Box hideBelow="lg" maxW="xl" w="full" mx="auto">
          <PlateauSketch />
        </Box>
        <Stack gap="3" maxW="lg">
          <Text fontSize={{ base: 'xl', md: '3xl' }} fontWeight="500" lineHeight="1.25" letterSpacing="-0.01em">
            Scan inflationary potentials across whole parameter grids, together with your group.
          </Text>
          <Text color="chrome.muted" fontSize="md" hideBelow="md">
            Queue a grid, watch it fill in, and compare spectral index and tensor ratio across runs.
          </Text>
        </Stack>
      </Flex>
      <Flex flex="1" align={{ base: 'start', lg: 'center' }} justify="center" px={{ base: '6', md: '12' }} py={{ base: '10', md: '16' }} bg="bg.canvas">
        <Box as="main" w="full" maxW="sm">
          <Heading as="h1" size="2xl" fontWeight="600" color="ink.900" mb="2" letterSpacing="-0.015em">
            {title}
          </Heading>
          <Text color="fg.muted" mb="8">
            {intro}
          </Text>
          {children}
        </Box>
      </Flex>
    </Flex>
  );
}

/** Decoration: a plateau potential with the field rolling along it, sample points trailing behind. */
function PlateauSketch() {
  return (
    <svg viewBox="0 0 560 300" width="100%" role="presentation" aria-hidden="true">
      <defs>
        <linearGradient id="sf-curve" x1="0" x2="1" y1="0" y2="0">
          <stop offset="0" stopColor="#ffd09e" />
          <stop offset="0.55" stopColor="#fb972f" />
          <stop offset="1" stopColor="#c8600b" />
        </linearGradient>
        <radialGradient id="sf-glow">
          <stop offset="0" stopColor="#ffb462" stopOpacity="0.55" />
          <stop offset="1" stopColor="#ffb462" stopOpacity="0" />
        </radialGradient>
      </defs>
      <g stroke="#8c99d3" strokeOpacity="0.35" strokeWidth="1">
        <path d="M30 20V270H548" fill="none" />
        {[70, 120, 170, 220].map((y) => (
          <path key={y} d={`M30 ${y}H548`} strokeDasharray="2 8" strokeOpacity="0.18" />
        ))}
      </g>
      <text x="38" y="30" fill="#8c99d3" fontFamily="'IBM Plex Mono', monospace" fontSize="13">V(φ)</text>
      <text x="532" y="290" fill="#8c99d3" fontFamily="'IBM Plex Mono', monospace" fontSize="13">φ</text>
      <path
        d="M40 88C160 88 260 90 320 104C380 118 420 250 470 250C500 250 520 232 540 206"
        fill="none"
        stroke="url(#sf-curve)"
        strokeWidth="3"
        strokeLinecap="round"
      />
      {[70, 105, 140, 175].map((x, i) => (
        <circle key={x} cx={x} cy="80" r="3" fill="#ffd09e" opacity={0.2 + i * 0.15} />
      ))}
      <circle cx="214" cy="76" r="26" fill="url(#sf-glow)" />
      <circle cx="214" cy="78" r="9" fill="#ffd09e" />
    </svg>
  );
}
