import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { colors, radius, touchTarget } from '../../constants/theme';

/** A track the finger or mouse drags along to move through the trial (0–1). */
export function ScrubBar({ value, onChange, label }: { value: number; onChange(v: number): void; label: string }) {
  const [width, setWidth] = useState(1);
  const at = (x: number) => onChange(Math.min(1, Math.max(0, x / width)));
  return (
    <View
      style={styles.hit}
      onLayout={(e) => setWidth(Math.max(1, e.nativeEvent.layout.width))}
      onStartShouldSetResponder={() => true}
      onMoveShouldSetResponder={() => true}
      onResponderGrant={(e) => at(e.nativeEvent.locationX)}
      onResponderMove={(e) => at(e.nativeEvent.locationX)}
      role="slider"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={Math.round(value * 100)}
      testID="scrub-bar"
    >
      <View style={styles.track} pointerEvents="none">
        <View style={[styles.fill, { width: `${value * 100}%` }]} />
      </View>
      <View style={[styles.knob, { left: `${value * 100}%` }]} pointerEvents="none" />
    </View>
  );
}

const styles = StyleSheet.create({
  hit: { height: touchTarget, justifyContent: 'center' },
  track: { height: 6, borderRadius: radius.sm, backgroundColor: colors.paperDeep, overflow: 'hidden' },
  fill: { height: '100%', backgroundColor: colors.ink },
  knob: { position: 'absolute', width: 18, height: 18, marginLeft: -9, borderRadius: 9, backgroundColor: colors.ember, borderWidth: 2, borderColor: colors.card },
});
