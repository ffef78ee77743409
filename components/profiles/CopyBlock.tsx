import { useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space } from '../../constants/theme';
import { Button } from '../ui/Button';

/** Copies through the browser's clipboard; false where there is none (the text stays selectable). */
export async function copyText(text: string): Promise<boolean> {
  if (Platform.OS !== 'web' || typeof navigator === 'undefined' || !navigator.clipboard) return false;
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/** A block of code or a command in the mono font, with a Copy button. */
export function CopyBlock({ label, text }: { label: string; text: string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  return (
    <View style={styles.wrap}>
      <View style={styles.head}>
        <Text style={styles.label}>{label}</Text>
        <Button
          label={state === 'copied' ? 'Copied' : 'Copy'}
          tone="quiet"
          accessibilityLabel={`Copy ${label.toLowerCase()}`}
          onPress={async () => setState((await copyText(text)) ? 'copied' : 'failed')}
        />
      </View>
      <Text selectable style={styles.code} aria-label={label}>
        {text}
      </Text>
      {state === 'failed' ? <Text style={styles.hint}>This browser did not allow copying; select the text instead.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink, flexShrink: 1 },
  code: {
    fontFamily: fonts.mono,
    fontSize: 13,
    lineHeight: 19,
    color: colors.onInk,
    backgroundColor: colors.ink,
    borderRadius: radius.sm,
    padding: space.md,
  },
  hint: { fontFamily: fonts.body, fontSize: 13, color: colors.graphite },
});
