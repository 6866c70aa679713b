/** Spacing scale in px; use these instead of literal margins. */
export const spacing = {
  xxs: 2,
  xs: 4,
  sm: 8,
  md: 12,
  lg: 16,
  xl: 24,
  xxl: 32,
  xxxl: 48,
} as const;

/** Corner radii in px. */
export const radius = { sm: 4, md: 8, lg: 12, pill: 999 } as const;

/** Layout breakpoints in px (phone first). */
export const breakpoints = {
  /** From here a side rail replaces the bottom bar. */
  wide: 900,
  /** From here inputs and results sit side by side. */
  large: 1200,
  /** Content is capped at this width on wide screens. */
  contentMax: 1160,
} as const;
