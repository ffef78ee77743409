import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space } from '../../constants/theme';
import { ChipGroup, type Choice } from '../ui/ChoiceChips';

/**
 * One line of mutually exclusive choices with its label at the start of the line, for the phone's tool strip
 * where a label above each row would cost a line apiece. The chips are ChoiceChips' own (ChipGroup).
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
  choices: readonly Choice<T>[];
  value: T | undefined;
  onChange(value: T): void;
  disabled?: boolean;
}) {
  return (
    <View style={styles.line}>
      {showLabel ? <Text style={styles.label}>{label}</Text> : null}
      <ChipGroup label={label} choices={choices} value={value} onChange={onChange} disabled={disabled} compact />
    </View>
  );
}

const styles = StyleSheet.create({
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  label: { fontFamily: fonts.bodyMedium, fontSize: 13, color: colors.ink, width: 62 },
});
