import { useEffect, useRef } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';

/** A second step before a change that costs money or takes room away: what will happen, then yes or no. */
export function ConfirmPanel({ message, confirmLabel, keepLabel, busy, onConfirm, onKeep }: {
  message: string;
  confirmLabel: string;
  keepLabel: string;
  busy: boolean;
  onConfirm(): void;
  onKeep(): void;
}) {
  const ref = useRef<View>(null);
  // The question opens where the answer is asked for: on a phone that can be below the fold, so bring it into view.
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const node = ref.current as unknown as { scrollIntoView?: (o: ScrollIntoViewOptions) => void } | null;
    node?.scrollIntoView?.({ block: 'center', behavior: 'auto' });
  }, []);
  return (
    <View ref={ref} style={styles.panel} role="group" aria-label="Confirm">
      <Text style={styles.text}>{message}</Text>
      <View style={styles.buttons}>
        <Button label={confirmLabel} tone="danger" busy={busy} onPress={onConfirm} />
        <Button label={keepLabel} tone="quiet" disabled={busy} onPress={onKeep} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md, padding: space.md, borderRadius: radius.md, borderWidth: 1.5, borderColor: colors.danger, backgroundColor: colors.card },
  text: { ...type.small, color: colors.ink },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
