import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';

export interface Choice<T extends string> {
  value: T;
  label: string;
}

/** A row of mutually exclusive choices; the chosen one is filled with ink. */
export function ChoiceChips<T extends string>({
  label,
  choices,
  value,
  onChange,
  disabled,
  error,
}: {
  label: string;
  choices: readonly Choice<T>[];
  value: T | undefined;
  onChange(value: T): void;
  disabled?: boolean;
  error?: string;
}) {
  return (
    <View style={styles.wrap}>
      <Text style={styles.label}>{label}</Text>
      <ChipGroup label={label} choices={choices} value={value} onChange={onChange} disabled={disabled} />
      {error ? (
        <Text role="alert" style={styles.error}>
          {error}
        </Text>
      ) : null}
    </View>
  );
}

/**
 * The chips alone, as a radiogroup of radios named by `label`; `compact` packs them tighter for a tool
 * strip. ChoiceChips puts its label above them, ChoiceRow (components/course) beside them.
 */
export function ChipGroup<T extends string>({
  label,
  choices,
  value,
  onChange,
  disabled,
  compact,
}: {
  label: string;
  choices: readonly Choice<T>[];
  value: T | undefined;
  onChange(value: T): void;
  disabled?: boolean;
  compact?: boolean;
}) {
  return (
    <View role="radiogroup" aria-label={label} style={[styles.row, compact && styles.rowCompact]}>
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
            style={[styles.chip, compact && styles.chipCompact, on && styles.chipOn, disabled && styles.disabled]}
          >
            <Text style={[styles.chipText, on && styles.chipTextOn]}>{c.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  rowCompact: { gap: 6, flexShrink: 1 },
  chip: {
    minHeight: touchTarget,
    minWidth: touchTarget,
    alignItems: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1.5,
    borderColor: colors.rule,
    backgroundColor: colors.card,
    justifyContent: 'center',
  },
  chipCompact: { paddingHorizontal: space.sm },
  chipOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  chipText: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  chipTextOn: { color: colors.onInk },
  disabled: { opacity: 0.5 },
  error: { fontFamily: fonts.body, fontSize: 13, color: colors.danger },
});
