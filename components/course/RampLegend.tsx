import { StyleSheet, Text, View } from 'react-native';
import Svg, { Defs, LinearGradient, Rect, Stop } from 'react-native-svg';
import { colors, space, type } from '../../constants/theme';
import { RAMP_CSS_STOPS } from './ramp';

/** The colour ramp with the heights at its ends. */
export function RampLegend({ lo, hi }: { lo: number; hi: number }) {
  return (
    <View style={styles.row} accessibilityLabel={`Colours run from ${lo.toFixed(2)} m (slate) to ${hi.toFixed(2)} m (rust)`}>
      <Text style={styles.figure}>{lo.toFixed(2)} m</Text>
      <Svg width={160} height={12}>
        <Defs>
          <LinearGradient id="treadle-ramp" x1="0" y1="0" x2="1" y2="0">
            {RAMP_CSS_STOPS.map((s) => (
              <Stop key={s.offset} offset={s.offset} stopColor={s.color} />
            ))}
          </LinearGradient>
        </Defs>
        <Rect x={0} y={0} width={160} height={12} rx={3} fill="url(#treadle-ramp)" />
      </Svg>
      <Text style={styles.figure}>{hi.toFixed(2)} m</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  figure: { ...type.figure, fontSize: 13, color: colors.graphite },
});
