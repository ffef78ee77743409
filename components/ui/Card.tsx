import { StyleSheet, View, type ViewProps } from 'react-native';
import { colors, radius, space } from '../../constants/theme';

export function Card({ style, ...rest }: ViewProps) {
  return <View style={[styles.card, style]} {...rest} />;
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.card,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.rule,
    padding: space.lg,
    gap: space.md,
  },
});
