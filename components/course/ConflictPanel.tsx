import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { TextField } from '../ui/TextField';
import { Notice } from '../ui/Notice';
import { ApiError } from '../../hooks/api';

/**
 * Someone saved the course while this edit was open. Nothing is lost: reload theirs (dropping these strokes,
 * said plainly), or keep these strokes as a new course.
 */
export function ConflictPanel({
  message,
  suggestedName,
  onReload,
  onSaveCopy,
}: {
  message: string;
  suggestedName: string;
  onReload(): Promise<void>;
  onSaveCopy(name: string): Promise<void>;
}) {
  const [copyName, setCopyName] = useState(suggestedName);
  const [busy, setBusy] = useState<'reload' | 'copy' | null>(null);
  const [error, setError] = useState<{ field?: string; message: string } | null>(null);

  async function run(which: 'reload' | 'copy') {
    setBusy(which);
    setError(null);
    try {
      await (which === 'reload' ? onReload() : onSaveCopy(copyName));
    } catch (err) {
      if (err instanceof ApiError && err.fields.name) setError({ field: 'name', message: err.fields.name });
      else setError({ message: err instanceof Error ? err.message : 'That did not work. Try again.' });
    } finally {
      setBusy(null);
    }
  }

  return (
    <Card style={styles.card} role="alert">
      <Text style={styles.heading}>Saved by someone else meanwhile</Text>
      <Text style={styles.body}>{message}</Text>
      <TextField label="Name of the copy" value={copyName} onChangeText={setCopyName} error={error?.field === 'name' ? error.message : undefined} />
      <View style={styles.row}>
        <Button label="Save mine as a copy" busy={busy === 'copy'} onPress={() => run('copy')} />
        <Button label="Reload theirs" tone="quiet" busy={busy === 'reload'} onPress={() => run('reload')} />
      </View>
      <Text style={styles.small}>Reloading drops the strokes you have not saved.</Text>
      {error && !error.field ? <Notice message={error.message} /> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { borderColor: colors.ember, borderWidth: 2 },
  heading: { ...type.heading, color: colors.ink },
  body: { ...type.body, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  small: { ...type.small, color: colors.graphite },
});
