import { ActivityIndicator, StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';

export function LoadingPage({ problem, onRetry }: { problem?: string; onRetry?: () => void }) {
  return (
    <View style={styles.page}>
      {problem ? (
        <>
          <Text style={styles.text}>{problem}</Text>
          {onRetry ? <Button label="Try again" tone="quiet" onPress={onRetry} /> : null}
        </>
      ) : (
        <ActivityIndicator color={colors.ember} size="large" />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.lg, padding: space.xl, backgroundColor: colors.paper },
  text: { ...type.body, color: colors.ink, textAlign: 'center' },
});
