import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';

/**
 * Toggle chips for picking several things; a picked chip is filled with ink and carries a check mark. A chip's
 * detail (a version's note) wraps in full under its label rather than being cut.
 */
export function PickChips({ label, choices, picked, onToggle, full }: { label: string; choices: { value: string; label: string; detail?: string }[]; picked: string[]; onToggle(value: string): void; full: boolean }) {
  return (
    <View style={styles.wrap}>
      <Text style={styles.label}>{label}</Text>
      <View role="group" aria-label={label} style={styles.row}>
        {choices.map((c) => {
          const on = picked.includes(c.value);
          const disabled = !on && full;
          return (
            <Pressable
              key={c.value}
              role="checkbox"
              aria-checked={on}
              aria-disabled={disabled}
              accessibilityLabel={disabled ? `${c.label} (four already picked)` : c.label}
              disabled={disabled}
              onPress={() => onToggle(c.value)}
              style={[styles.chip, c.detail ? styles.withDetail : null, on && styles.on, disabled && styles.disabled]}
            >
              <Text style={[styles.text, on && styles.textOn]}>{on ? `✓ ${c.label}` : c.label}</Text>
              {c.detail ? <Text style={[styles.detail, on && styles.textOn]}>{c.detail}</Text> : null}
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: { minHeight: touchTarget, minWidth: touchTarget, paddingHorizontal: space.md, borderRadius: radius.md, borderWidth: 1.5, borderColor: colors.rule, backgroundColor: colors.card, justifyContent: 'center' },
  withDetail: { paddingVertical: space.sm, maxWidth: 420, flexShrink: 1 },
  on: { backgroundColor: colors.ink, borderColor: colors.ink },
  disabled: { opacity: 0.45 },
  text: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  detail: { fontFamily: fonts.body, fontSize: 12, lineHeight: 16, color: colors.graphite, marginTop: 2 },
  textOn: { color: colors.onInk },
});
