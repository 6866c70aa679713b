import Svg, { Circle, Path, Rect } from 'react-native-svg';

import { colors, type ColorName } from '../../theme';

export type IconName =
  | 'sites'
  | 'quick'
  | 'team'
  | 'settings'
  | 'pass'
  | 'caution'
  | 'fail'
  | 'info'
  | 'mail'
  | 'plus'
  | 'signout'
  | 'delete'
  | 'people';

export interface IconProps {
  name: IconName;
  size?: number;
  tone?: ColorName;
  /** Icons are decorative unless given a label; the word next to them carries the meaning. */
  label?: string;
}

/** A small set of line icons drawn in our own style (1.75 px strokes, round caps). */
export function Icon({ name, size = 22, tone = 'text', label }: IconProps) {
  const c = colors[tone];
  const stroke = { stroke: c, strokeWidth: 1.75, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const, fill: 'none' };
  return (
    <Svg
      width={size}
      height={size}
      viewBox="0 0 24 24"
      aria-hidden={label ? undefined : true}
      aria-label={label}
    >
      {name === 'sites' && (
        <>
          <Path d="M3 20h18" {...stroke} />
          <Path d="M5 20V9l5 3V9l5 3V5h4v15" {...stroke} />
        </>
      )}
      {name === 'quick' && (
        <>
          <Rect x={3} y={9} width={18} height={6} rx={3} {...stroke} />
          <Path d="M7 9V6M12 9V4M17 9V6" {...stroke} />
          <Path d="M7 18v2M12 18v2M17 18v2" {...stroke} />
        </>
      )}
      {name === 'team' && (
        <>
          <Circle cx={9} cy={8} r={3.25} {...stroke} />
          <Path d="M3 20c0-3.3 2.7-6 6-6s6 2.7 6 6" {...stroke} />
          <Path d="M16 5.2a3 3 0 0 1 0 5.6M18 14.5c1.8.9 3 2.9 3 5.5" {...stroke} />
        </>
      )}
      {name === 'settings' && (
        <>
          <Path d="M4 7h9M17 7h3M4 17h3M11 17h9" {...stroke} />
          <Circle cx={15} cy={7} r={2} {...stroke} />
          <Circle cx={9} cy={17} r={2} {...stroke} />
        </>
      )}
      {name === 'pass' && (
        <>
          <Circle cx={12} cy={12} r={9} {...stroke} />
          <Path d="M8 12.5l2.7 2.7L16 9.8" {...stroke} />
        </>
      )}
      {name === 'caution' && (
        <>
          <Path d="M12 3.5L21.5 20h-19z" {...stroke} />
          <Path d="M12 10v4.5M12 17.3v.2" {...stroke} />
        </>
      )}
      {name === 'fail' && (
        <>
          <Circle cx={12} cy={12} r={9} {...stroke} />
          <Path d="M9 9l6 6M15 9l-6 6" {...stroke} />
        </>
      )}
      {name === 'info' && (
        <>
          <Circle cx={12} cy={12} r={9} {...stroke} />
          <Path d="M12 11v6M12 7.5v.2" {...stroke} />
        </>
      )}
      {name === 'mail' && (
        <>
          <Rect x={3} y={5.5} width={18} height={13} rx={2} {...stroke} />
          <Path d="M3.5 7l8.5 6 8.5-6" {...stroke} />
        </>
      )}
      {name === 'plus' && <Path d="M12 5v14M5 12h14" {...stroke} />}
      {name === 'delete' && (
        <>
          <Path d="M4 7h16M10 7V4.5h4V7" {...stroke} />
          <Path d="M6 7l1 13h10l1-13" {...stroke} />
          <Path d="M10 11v5M14 11v5" {...stroke} />
        </>
      )}
      {name === 'people' && (
        <>
          <Circle cx={8} cy={9} r={2.75} {...stroke} />
          <Circle cx={16} cy={9} r={2.75} {...stroke} />
          <Path d="M3 19c0-2.8 2.2-5 5-5s5 2.2 5 5M11 19c0-2.8 2.2-5 5-5s5 2.2 5 5" {...stroke} />
        </>
      )}
      {name === 'signout' && (
        <>
          <Path d="M14 4H6v16h8" {...stroke} />
          <Path d="M10 12h10M17 9l3 3-3 3" {...stroke} />
        </>
      )}
    </Svg>
  );
}
