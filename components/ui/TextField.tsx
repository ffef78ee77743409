import { StyleSheet, Text, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';

export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input whose server or schema message appears right under it. */
export function TextField({ label, error, hint, nativeID, ...input }: TextFieldProps) {
  const id = nativeID ?? `field-${label.toLowerCase().replace(/\W+/g, '-')}`;
  return (
    <View style={styles.wrap}>
      <Text style={styles.label} nativeID={`${id}-label`}>
        {label}
      </Text>
      <TextInput
        nativeID={id}
        accessibilityLabel={label}
        aria-invalid={error ? true : undefined}
        placeholderTextColor={colors.graphite}
        style={[styles.input, error ? styles.inputError : null]}
        {...input}
      />
      {error ? (
        <Text style={styles.error} role="alert">
          {error}
        </Text>
      ) : hint ? (
        <Text style={styles.hint}>{hint}</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  label: { ...type.label, color: colors.ink },
  input: {
    minHeight: touchTarget,
    borderWidth: 1.5,
    borderColor: colors.rule,
    borderRadius: radius.sm,
    backgroundColor: colors.card,
    paddingHorizontal: space.md,
    fontFamily: fonts.body,
    fontSize: 16,
    color: colors.ink,
  },
  inputError: { borderColor: colors.danger },
  error: { ...type.small, color: colors.danger },
  hint: { ...type.small, color: colors.graphite },
});
