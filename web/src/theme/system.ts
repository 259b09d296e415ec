import { createSystem, defaultConfig, defineConfig } from '@chakra-ui/react';

// Night-sky ink for chrome, an ember accent, and warm "dust" neutrals instead of cool greys.
const ink = {
  50: '#eef1fb',
  100: '#dce1f4',
  200: '#b8c1e8',
  300: '#8c99d3',
  400: '#6070b9',
  500: '#43529e',
  600: '#323f83',
  700: '#253068',
  800: '#1a234f',
  900: '#111735',
  950: '#0a0e22',
};
const ember = {
  50: '#fff7ed',
  100: '#ffead1',
  200: '#ffd09e',
  300: '#ffb462',
  400: '#fb972f',
  500: '#ea7a12',
  600: '#c8600b',
  700: '#9f490d',
  800: '#7f3b12',
  900: '#683213',
  950: '#3b1706',
};
const dust = {
  50: '#faf9f6',
  100: '#f3f1ec',
  200: '#e7e3da',
  300: '#d3cdc1',
  400: '#aea796',
  500: '#878070',
  600: '#686153',
  700: '#4f4a40',
  800: '#37332d',
  900: '#24211d',
  950: '#151310',
};

type Scale = Record<keyof typeof ink, string>;
const toTokens = (scale: Scale) =>
  Object.fromEntries(Object.entries(scale).map(([step, value]) => [step, { value }]));

const config = defineConfig({
  globalCss: {
    'html, body': { bg: 'bg.canvas', color: 'fg' },
    body: { fontFeatureSettings: "'kern', 'liga'" },
  },
  theme: {
    tokens: {
      colors: {
        ink: toTokens(ink),
        ember: toTokens(ember),
        dust: toTokens(dust),
        // Chakra's own semantic tokens (bg, fg, border, gray palette) read from `gray`,
        // so pointing gray at dust warms every neutral in one move.
        gray: toTokens(dust),
      },
      fonts: {
        body: { value: "'IBM Plex Sans', system-ui, sans-serif" },
        heading: { value: "'IBM Plex Sans', system-ui, sans-serif" },
        mono: { value: "'IBM Plex Mono', ui-monospace, monospace" },
      },
    },
    semanticTokens: {
      colors: {
        ink: {
          solid: { value: '{colors.ink.800}' },
          contrast: { value: '{colors.ink.50}' },
          fg: { value: '{colors.ink.700}' },
          muted: { value: '{colors.ink.100}' },
          subtle: { value: '{colors.ink.50}' },
          emphasized: { value: '{colors.ink.200}' },
          focusRing: { value: '{colors.ink.500}' },
        },
        ember: {
          solid: { value: '{colors.ember.400}' },
          contrast: { value: '{colors.ink.950}' },
          fg: { value: '{colors.ember.700}' },
          muted: { value: '{colors.ember.100}' },
          subtle: { value: '{colors.ember.50}' },
          emphasized: { value: '{colors.ember.200}' },
          focusRing: { value: '{colors.ember.500}' },
        },
        bg: {
          canvas: { value: '{colors.dust.50}' },
          panel: { value: '{colors.white}' },
        },
        // The app chrome (header, sign-in sky) is always dark ink.
        chrome: {
          bg: { value: '{colors.ink.900}' },
          raised: { value: '{colors.ink.800}' },
          fg: { value: '{colors.ink.50}' },
          muted: { value: '{colors.ink.300}' },
          accent: { value: '{colors.ember.300}' },
        },
      },
    },
  },
});

export const system = createSystem(defaultConfig, config);
