import { Pressable, StyleSheet, Text, ActivityIndicator, type PressableProps } from 'react-native';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';

type Tone = 'action' | 'quiet' | 'danger';

export interface ButtonProps extends Omit<PressableProps, 'children' | 'style'> {
  label: string;
  tone?: Tone;
  busy?: boolean;
}

export function Button({ label, tone = 'action', busy = false, disabled, ...rest }: ButtonProps) {
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityState={{ disabled: !!inactive, busy }}
      disabled={inactive}
      style={({ pressed }) => [styles.base, toneStyles[tone], pressed && pressedStyles[tone], inactive && styles.inactive]}
      {...rest}
    >
      {busy ? <ActivityIndicator color={tone === 'action' ? colors.onInk : colors.ink} /> : null}
      <Text style={[styles.label, tone === 'action' ? styles.labelOnEmber : styles.labelOnPaper]}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: touchTarget,
    minWidth: touchTarget,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.sm,
  },
  inactive: { opacity: 0.55 },
  label: { fontFamily: fonts.bodyStrong, fontSize: 15 },
  labelOnEmber: { color: colors.onInk },
  labelOnPaper: { color: colors.ink },
});

const toneStyles = StyleSheet.create({
  action: { backgroundColor: colors.ember },
  quiet: { backgroundColor: 'transparent', borderWidth: 1.5, borderColor: colors.ink },
  danger: { backgroundColor: 'transparent', borderWidth: 1.5, borderColor: colors.danger },
});

const pressedStyles = StyleSheet.create({
  action: { backgroundColor: colors.emberPressed },
  quiet: { backgroundColor: colors.paperDeep },
  danger: { backgroundColor: colors.paperDeep },
});
