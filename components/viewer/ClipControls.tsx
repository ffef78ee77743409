import { useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { clipSupported, download, recordClip, stillOf, type Caption } from './clip';

export const CLIP_SECONDS = 4;

const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'walk';

/**
 * Share the walk: a few seconds as a WebM clip, or the current frame as PNG, each with the caption in its corner.
 * Recording plays the walk (`onRecording(true)`) and stops it after. Web only.
 */
export function ClipControls({ canvas, caption, name, onRecording }: { canvas: () => HTMLCanvasElement | null; caption: Caption; name: string; onRecording(on: boolean): void }) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  if (Platform.OS !== 'web') return null;
  const supported = clipSupported();
  const source = () => {
    const c = canvas();
    if (!c) throw new Error('The 3D view is not ready yet.');
    return c;
  };
  return (
    <View style={styles.wrap}>
      <View style={styles.row}>
        <Button
          label={busy ? 'Recording…' : `Record a ${CLIP_SECONDS} s clip`}
          tone="quiet"
          disabled={!supported || busy}
          busy={busy}
          onPress={async () => {
            setProblem(null);
            setBusy(true);
            onRecording(true);
            try {
              download(await recordClip(source(), caption, CLIP_SECONDS), `${slug(name)}.webm`);
            } catch (err) {
              setProblem((err as Error).message);
            } finally {
              onRecording(false);
              setBusy(false);
            }
          }}
        />
        <Button
          label="Save still (PNG)"
          tone="quiet"
          disabled={busy}
          onPress={async () => {
            setProblem(null);
            try {
              download(await stillOf(source(), caption), `${slug(name)}.png`);
            } catch (err) {
              setProblem((err as Error).message);
            }
          }}
        />
      </View>
      {!supported ? <Text style={styles.note}>This browser cannot record video; saving a still works.</Text> : null}
      {problem ? (
        <Text role="alert" style={styles.note}>
          {problem}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  note: { ...type.small, color: colors.graphite },
});
