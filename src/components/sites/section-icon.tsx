import Svg, { Path, Rect } from 'react-native-svg';

import { colors, type ColorName } from '../../theme';
import { Icon, type IconName } from '../ui';

/** Glyphs of a site's sections that the shared icon set lacks, drawn in the same style. */
export type SectionGlyph = 'overview' | 'lines' | 'vessels' | 'revisions' | 'library' | 'sizing';

export type SectionIconName = IconName | SectionGlyph;

const GLYPHS: readonly string[] = ['overview', 'lines', 'vessels', 'revisions', 'library', 'sizing'];

/** An icon of a site section: one of the shared icons, or a section glyph. Decorative. */
export function SectionIcon({ name, size = 22, tone = 'text' }: { name: SectionIconName; size?: number; tone?: ColorName }) {
  if (!GLYPHS.includes(name)) return <Icon name={name as IconName} size={size} tone={tone} />;
  const stroke = { stroke: colors[tone], strokeWidth: 1.75, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const, fill: 'none' };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" aria-hidden>
      {name === 'overview' && (
        <>
          <Path d="M4 20h16" {...stroke} />
          <Path d="M7 17v-5M12 17V7M17 17v-8" {...stroke} />
        </>
      )}
      {name === 'lines' && (
        <>
          <Path d="M3 8h18M3 16h18" {...stroke} />
          <Path d="M7 6v4M7 14v4M17 6v4M17 14v4" {...stroke} />
        </>
      )}
      {name === 'vessels' && (
        <>
          <Rect x={6} y={3} width={12} height={18} rx={5} {...stroke} />
          <Path d="M6 9h12M6 15h12" {...stroke} />
        </>
      )}
      {name === 'revisions' && (
        <>
          <Path d="M7 3h7l4 4v14H7z" {...stroke} />
          <Path d="M14 3v4h4M10 12h5M10 16h5" {...stroke} />
        </>
      )}
      {name === 'library' && (
        <>
          <Path d="M5 4h4v16H5zM10 4h4v16h-4z" {...stroke} />
          <Path d="M15.5 5.2l3.6-1 3.4 15.6-3.6 1z" {...stroke} />
        </>
      )}
      {name === 'sizing' && (
        <>
          <Rect x={3} y={8} width={18} height={8} rx={1.5} {...stroke} />
          <Path d="M7 8v3M11 8v4M15 8v3M19 8v2" {...stroke} />
        </>
      )}
    </Svg>
  );
}
