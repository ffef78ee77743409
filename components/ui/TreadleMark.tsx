import { StyleSheet, Text, View } from 'react-native';
import Svg, { Circle, Path } from 'react-native-svg';
import { colors, fonts } from '../../constants/theme';

/** The wordmark: a bent leg planted on a ridge of ground, then the name. */
export function TreadleMark({ size = 28, inverse = false }: { size?: number; inverse?: boolean }) {
  const ink = inverse ? colors.onInk : colors.ink;
  return (
    <View style={styles.row} accessibilityLabel="Treadle" role="img">
      <Svg width={size} height={size} viewBox="0 0 32 32">
        <Path d="M2 27 L10 24 L17 26 L24 22 L30 25" stroke={colors.ember} strokeWidth={2.5} fill="none" strokeLinecap="round" />
        <Path d="M12 5 L19 13 L13 22" stroke={ink} strokeWidth={3} fill="none" strokeLinecap="round" strokeLinejoin="round" />
        <Circle cx={12} cy={5} r={2.5} fill={ink} />
        <Circle cx={19} cy={13} r={2} fill={ink} />
      </Svg>
      <Text style={[styles.word, { color: ink, fontSize: size * 0.78 }]}>Treadle</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 6 },
  word: { fontFamily: fonts.heading, letterSpacing: -0.5 },
});
