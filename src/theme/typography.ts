/**
 * Source Sans 3 is bundled with the app (single weights, loaded in the root layout).
 * Every number uses tabular figures so columns and live results do not jitter.
 */
export const fonts = {
  regular: 'SourceSans3_400Regular',
  semibold: 'SourceSans3_600SemiBold',
  bold: 'SourceSans3_700Bold',
} as const;

export const fontSizes = {
  caption: 13,
  body: 16,
  label: 14,
  title: 20,
  heading: 26,
  result: 34,
} as const;

export const lineHeights = {
  caption: 18,
  body: 22,
  label: 20,
  title: 26,
  heading: 32,
  result: 40,
} as const;

/** Style fragment that turns on tabular (monospaced) figures on web and native. */
export const tabularFigures = { fontVariant: ['tabular-nums'] as ('tabular-nums')[] };
