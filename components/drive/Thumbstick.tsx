import { useRef, useState } from 'react';
import { PanResponder, StyleSheet, View, type GestureResponderEvent } from 'react-native';
import { colors } from '../../constants/theme';

/** Where the stick is pushed: x to the right, y up, each in [−1, 1] (length at most 1). */
export interface StickValue {
  x: number;
  y: number;
}

const SIZE = 132;
const KNOB = 56;

/**
 * An on-screen thumbstick: press anywhere on the pad and drag; letting go springs it back to the middle.
 * It writes into `value` (a ref the draw loop reads every frame) rather than re-rendering its parent.
 */
export function Thumbstick({ value, label }: { value: { current: StickValue }; label: string }) {
  const [knob, setKnob] = useState({ x: 0, y: 0 });
  const origin = useRef({ x: 0, y: 0 });
  const place = (e: GestureResponderEvent, start: boolean) => {
    const { pageX, pageY, locationX, locationY } = e.nativeEvent;
    // The pad's centre in page coordinates, taken once per press (locationX/Y are relative to the touched element).
    if (start) origin.current = { x: pageX - locationX + SIZE / 2, y: pageY - locationY + SIZE / 2 };
    const r = SIZE / 2;
    let x = (pageX - origin.current.x) / r;
    let y = (pageY - origin.current.y) / r;
    const n = Math.hypot(x, y);
    if (n > 1) {
      x /= n;
      y /= n;
    }
    value.current = { x, y: -y };
    setKnob({ x: x * (r - KNOB / 2), y: y * (r - KNOB / 2) });
  };
  const release = () => {
    value.current = { x: 0, y: 0 };
    setKnob({ x: 0, y: 0 });
  };
  const responder = useRef(
    PanResponder.create({
      onStartShouldSetPanResponder: () => true,
      onMoveShouldSetPanResponder: () => true,
      onPanResponderTerminationRequest: () => false,
      onPanResponderGrant: (e) => place(e, true),
      onPanResponderMove: (e) => place(e, false),
      onPanResponderRelease: release,
      onPanResponderTerminate: release,
    }),
  ).current;
  return (
    <View style={styles.pad} {...responder.panHandlers} role="slider" aria-label={label} aria-valuemin={-100} aria-valuemax={100} aria-valuenow={Math.round((-knob.y / (SIZE / 2 - KNOB / 2)) * 100)} testID="drive-stick">
      <View pointerEvents="none" style={[styles.knob, { transform: [{ translateX: knob.x }, { translateY: knob.y }] }]} />
    </View>
  );
}

const styles = StyleSheet.create({
  pad: { width: SIZE, height: SIZE, borderRadius: SIZE / 2, backgroundColor: 'rgba(30, 37, 43, 0.10)', borderWidth: 2, borderColor: colors.graphite, alignItems: 'center', justifyContent: 'center', touchAction: 'none', userSelect: 'none' } as object,
  knob: { width: KNOB, height: KNOB, borderRadius: KNOB / 2, backgroundColor: colors.ember },
});
