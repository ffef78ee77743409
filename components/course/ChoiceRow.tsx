import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';

/**
 * One line of mutually exclusive choices with its label at the start of the line, for the phone's tool strip
 * where a label above each row would cost a line apiece. Same roles as ChoiceChips (radiogroup of radios).
 */
export function ChoiceRow<T extends string>({
  label,
  showLabel = true,
  choices,
  value,
  onChange,
  disabled,
}: {
  label: string;
  showLabel?: boolean;
  choices: readonly { value: T; label: string }[];
  value: T | undefined;
  onChange(value: T): void;
  disabled?: boolean;
}) {
  return (
    <View style={styles.line}>
      {showLabel ? <Text style={styles.label}>{label}</Text> : null}
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {choices.map((c) => {
          const on = c.value === value;
          return (
            <Pressable
              key={c.value}
              role="radio"
              aria-checked={on}
              accessibilityLabel={c.label}
              disabled={disabled}
              onPress={() => onChange(c.value)}
              style={[styles.chip, on && styles.chipOn, disabled && styles.disabled]}
            >
              <Text style={[styles.chipText, on && styles.chipTextOn]}>{c.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  label: { fontFamily: fonts.bodyMedium, fontSize: 13, color: colors.ink, width: 62 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 6, flexShrink: 1 },
  chip: {
    minHeight: touchTarget,
    minWidth: touchTarget,
    paddingHorizontal: space.sm,
    borderRadius: radius.md,
    borderWidth: 1.5,
    borderColor: colors.rule,
    backgroundColor: colors.card,
    alignItems: 'center',
    justifyContent: 'center',
  },
  chipOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  chipText: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  chipTextOn: { color: colors.onInk },
  disabled: { opacity: 0.5 },
});
