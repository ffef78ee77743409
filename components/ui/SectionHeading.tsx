import { StyleSheet, Text } from 'react-native';
import { colors, type } from '../../constants/theme';

export function SectionHeading({ children }: { children: string }) {
  return (
    <Text role="heading" aria-level={2} style={styles.heading}>
      {children}
    </Text>
  );
}

const styles = StyleSheet.create({ heading: { ...type.heading, color: colors.ink } });
