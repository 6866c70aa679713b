/**
 * Lagline's palette: warm paper, slate ink, an ember accent for heat and a steel accent for cold.
 * The raw palette stays private; screens use the semantic names below.
 */
const palette = {
  paper: '#FAF7F2',
  paperRaised: '#FFFFFF',
  paperSunk: '#F1ECE4',
  slate900: '#1E2A33',
  slate700: '#3B4A55',
  slate600: '#4F5E69',
  slate300: '#B9C1C7',
  slate200: '#D9DDE0',
  slate100: '#E8ECEF',
  ember700: '#B23A12',
  ember500: '#D9531E',
  ember100: '#FBE3D8',
  steel700: '#1F5A85',
  steel500: '#2F78AD',
  steel100: '#DCEAF5',
  green700: '#1E6B37',
  green100: '#DDF0E2',
  amber700: '#8A5A00',
  amber100: '#FBEFD0',
  red700: '#B0182B',
  red100: '#F8DADD',
} as const;

export const colors = {
  /** Page background. */
  background: palette.paper,
  /** Cards, inputs and panels that sit on the page. */
  surface: palette.paperRaised,
  /** Recessed areas: table stripes, chart plot area. */
  surfaceSunk: palette.paperSunk,
  /** Body text and numbers (AA on every background above). */
  text: palette.slate900,
  /** Secondary text: labels, units, captions (AA on paper). */
  textMuted: palette.slate600,
  /** Borders and dividers. */
  border: palette.slate200,
  /** Stronger borders: inputs, focused outlines' base. */
  borderStrong: palette.slate300,
  /** Heat accent: hot-service limits and heat in charts (never an action or a selection: it sits too near danger red). */
  heat: palette.ember700,
  /** Heat accent, lighter, for chart lines on paper. */
  heatLine: palette.ember500,
  /** Soft heat tint for highlighted hot results. */
  heatSoft: palette.ember100,
  /** Cold accent: cold-service limits and dew point. */
  cold: palette.steel700,
  /** Cold accent, lighter, for chart lines. */
  coldLine: palette.steel500,
  /** Soft cold tint. */
  coldSoft: palette.steel100,
  /** Pass state (always with an icon or word). */
  pass: palette.green700,
  passSoft: palette.green100,
  /** Caution state (always with an icon or word). */
  caution: palette.amber700,
  cautionSoft: palette.amber100,
  /** Fail state (always with an icon or word). */
  fail: palette.red700,
  failSoft: palette.red100,
  /** Destructive actions: the fail red, always with a warning icon and a plain word ("Delete", "Remove"). */
  danger: palette.red700,
  /** Primary actions: slate ink, far from the danger red in hue and lightness. */
  action: palette.slate900,
  /** Links and quiet actions: steel blue, underlined or worded so they never rest on colour alone. */
  link: palette.steel700,
  /** The chosen option of a group (chips, radios, lists, the current page): ink border with a check mark. */
  selected: palette.slate900,
  /** Background of the chosen option. */
  selectedSoft: palette.slate100,
  /** Text on an action or danger button. */
  onAccent: palette.paperRaised,
  /** Keyboard focus ring. */
  focus: palette.steel500,
} as const;

export type ColorName = keyof typeof colors;
