import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { CourseDetail } from '../../schemas/courses';
import { colors, fonts, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { TextField } from '../ui/TextField';
import { Notice } from '../ui/Notice';
import { formatLocalMoment as formatMoment } from '../setup/local-dates';
import { recipeLine } from './generatorFields';

/** Name, where the course came from, the suites that hold it, and deleting it. */
export function CourseDetails({
  detail,
  mayEdit,
  name,
  nameError,
  onName,
  onDelete,
}: {
  detail: CourseDetail;
  mayEdit: boolean;
  name: string;
  nameError?: string;
  onName(v: string): void;
  onDelete(): Promise<void>;
}) {
  const [confirming, setConfirming] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const c = detail.course;

  async function remove() {
    setDeleting(true);
    setProblem(null);
    try {
      await onDelete();
    } catch (err) {
      setProblem(err instanceof Error ? err.message : 'The course could not be deleted.');
      setConfirming(false);
    } finally {
      setDeleting(false);
    }
  }

  return (
    <Card>
      {mayEdit ? <TextField label="Course name" value={name} onChangeText={onName} error={nameError} hint="Saved with the heights." /> : null}
      <View style={styles.line}>
        <Text style={styles.key}>Made from</Text>
        <Text style={styles.value}>{detail.generator ? recipeLine(detail.generator) : 'an uploaded encoding'}</Text>
      </View>
      <View style={styles.line}>
        <Text style={styles.key}>Grid</Text>
        <Text style={styles.figure}>
          {c.cols} × {c.rows} samples
        </Text>
      </View>
      <View style={styles.line}>
        <Text style={styles.key}>In suites</Text>
        <Text style={styles.value}>{c.suites.length ? c.suites.map((s) => s.name).join(', ') : 'none'}</Text>
      </View>
      <View style={styles.line}>
        <Text style={styles.key}>Last saved</Text>
        <Text style={styles.value}>
          {c.updatedBy.name}, {formatMoment(c.updatedAt)}
        </Text>
      </View>
      {problem ? <Notice message={problem} /> : null}
      {mayEdit && !confirming ? <Button label="Delete course" tone="danger" onPress={() => setConfirming(true)} /> : null}
      {mayEdit && confirming ? (
        <View style={styles.confirm}>
          <Text style={styles.value}>Delete “{c.name}” for the whole team? This cannot be undone.</Text>
          <View style={styles.row}>
            <Button label="Delete for good" tone="danger" busy={deleting} onPress={remove} />
            <Button label="Keep it" tone="quiet" onPress={() => setConfirming(false)} />
          </View>
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  line: { gap: 2 },
  key: { ...type.label, color: colors.graphite },
  value: { ...type.body, color: colors.ink },
  figure: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink },
  confirm: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
