import { View } from 'react-native';

import { colors } from '../../theme';

/** Lagline's mark: a dark tile crossed by one warm band (a lagged line). Decorative, hidden from readers. */
export function BrandMark({ size }: { size: number }) {
  return (
    <View
      aria-hidden
      style={{
        width: size,
        height: size,
        borderRadius: size / 4,
        backgroundColor: colors.text,
        justifyContent: 'center',
        paddingHorizontal: Math.round(size * 0.15),
      }}
    >
      <View style={{ height: Math.round(size * 0.225), borderRadius: 2, backgroundColor: colors.heatLine }} />
    </View>
  );
}
