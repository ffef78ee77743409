import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { suiteCreateSchema, type CourseSummary, type Suite, type SuiteCreate } from '../../schemas/courses';
import { fieldMessages } from '../../schemas/errors';
import { ApiError } from '../../hooks/api';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';

export interface SuitesSectionProps {
  suites: Suite[];
  courses: CourseSummary[];
  mayEdit: boolean;
  onCreate(s: SuiteCreate): Promise<unknown>;
  onUpdate(id: number, s: SuiteCreate): Promise<unknown>;
  onDelete(id: number): Promise<unknown>;
}

/** Suites: named sets of courses run together, in running order. */
export function SuitesSection({ suites, courses, mayEdit, onCreate, onUpdate, onDelete }: SuitesSectionProps) {
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const wide = useIsWide();
  return (
    <View style={styles.section}>
      <View style={styles.head}>
        <SectionHeading>Suites</SectionHeading>
        {mayEdit && editing === null && courses.length ? <Button label="New suite" tone="quiet" onPress={() => setEditing('new')} /> : null}
      </View>
      {editing === 'new' ? <SuiteEditor courses={courses} onSave={(s) => onCreate(s)} onDone={() => setEditing(null)} /> : null}
      {suites.length === 0 && editing !== 'new' ? <Text style={styles.muted}>No suites yet. A suite lets a trial or a dial-in run several courses in one go.</Text> : null}
      <View style={[styles.grid, wide && styles.gridWide]}>
        {suites.map((s) =>
          editing === s.id ? (
            <View key={s.id} style={wide ? styles.gridItem : undefined}>
              <SuiteEditor suite={s} courses={courses} onSave={(v) => onUpdate(s.id, v)} onDelete={() => onDelete(s.id)} onDone={() => setEditing(null)} />
            </View>
          ) : (
            <Card key={s.id} style={wide ? styles.gridItem : undefined} aria-label={`Suite ${s.name}`}>
              <Text style={styles.name}>{s.name}</Text>
              <View style={styles.list}>
                {s.courses.map((c, i) => (
                  <Text key={c.id} style={styles.item}>
                    <Text style={styles.ordinal}>{i + 1}. </Text>
                    {c.name}
                  </Text>
                ))}
              </View>
              {mayEdit && editing === null ? <Button label={`Edit ${s.name}`} tone="quiet" onPress={() => setEditing(s.id)} /> : null}
            </Card>
          ),
        )}
      </View>
    </View>
  );
}

function SuiteEditor({
  suite,
  courses,
  onSave,
  onDelete,
  onDone,
}: {
  suite?: Suite;
  courses: CourseSummary[];
  onSave(s: SuiteCreate): Promise<unknown>;
  onDelete?(): Promise<unknown>;
  onDone(): void;
}) {
  const [name, setName] = useState(suite?.name ?? '');
  const [chosen, setChosen] = useState<number[]>(suite?.courses.map((c) => c.id) ?? []);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const nameOf = (id: number) => courses.find((c) => c.id === id)?.name ?? `Course ${id}`;

  function toggle(id: number) {
    setChosen((ids) => (ids.includes(id) ? ids.filter((x) => x !== id) : [...ids, id]));
    setErrors(({ courseIds: _gone, ...rest }) => rest);
  }

  function move(i: number, by: -1 | 1) {
    setChosen((ids) => {
      const next = [...ids];
      [next[i], next[i + by]] = [next[i + by], next[i]];
      return next;
    });
  }

  async function run(action: () => Promise<unknown>) {
    setBusy(true);
    setProblem(null);
    try {
      await action();
      onDone();
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(err.fields);
      else setProblem(err instanceof Error ? err.message : 'That did not work. Try again.');
    } finally {
      setBusy(false);
    }
  }

  function save() {
    const checked = suiteCreateSchema.safeParse({ name, courseIds: chosen });
    if (!checked.success) return setErrors(fieldMessages(checked.error.issues));
    void run(() => onSave(checked.data));
  }

  const courseError = Object.entries(errors).find(([k]) => k.startsWith('courseIds'))?.[1];
  return (
    <Card>
      <Text style={styles.name}>{suite ? `Edit ${suite.name}` : 'New suite'}</Text>
      <TextField label="Suite name" value={name} onChangeText={setName} error={errors.name} />
      <Text style={styles.label}>Courses, in running order</Text>
      {chosen.map((id, i) => (
        <View key={id} style={styles.chosenRow}>
          <Text style={styles.item}>
            <Text style={styles.ordinal}>{i + 1}. </Text>
            {nameOf(id)}
          </Text>
          <View style={styles.rowButtons}>
            <Button label="↑" tone="quiet" accessibilityLabel={`Move ${nameOf(id)} earlier`} disabled={i === 0} onPress={() => move(i, -1)} />
            <Button label="↓" tone="quiet" accessibilityLabel={`Move ${nameOf(id)} later`} disabled={i === chosen.length - 1} onPress={() => move(i, 1)} />
          </View>
        </View>
      ))}
      <View style={styles.pickList}>
        {courses.map((c) => {
          const on = chosen.includes(c.id);
          return (
            <Pressable key={c.id} role="checkbox" aria-checked={on} accessibilityLabel={c.name} onPress={() => toggle(c.id)} style={[styles.pick, on && styles.pickOn]}>
              <Text style={[styles.pickText, on && styles.pickTextOn]}>{on ? '✓ ' : ''}{c.name}</Text>
            </Pressable>
          );
        })}
      </View>
      {courseError ? <Text role="alert" style={styles.error}>{courseError}</Text> : null}
      {problem ? <Notice message={problem} /> : null}
      <View style={styles.rowButtons}>
        <Button label={suite ? 'Save suite' : 'Make suite'} busy={busy} onPress={save} />
        <Button label="Cancel" tone="quiet" onPress={onDone} />
        {onDelete ? <Button label="Delete suite" tone="danger" onPress={() => run(onDelete)} /> : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', gap: space.md },
  grid: { gap: space.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  gridItem: { flexBasis: 340, flexGrow: 1 },
  name: { ...type.heading, color: colors.ink },
  list: { gap: 2 },
  item: { ...type.body, color: colors.ink, flexShrink: 1 },
  ordinal: { fontFamily: fonts.mono, color: colors.graphite },
  muted: { ...type.body, color: colors.graphite },
  label: { ...type.label, color: colors.ink },
  chosenRow: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  rowButtons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  pickList: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  pick: { minHeight: touchTarget, paddingHorizontal: space.md, borderRadius: radius.md, borderWidth: 1.5, borderColor: colors.rule, backgroundColor: colors.card, justifyContent: 'center' },
  pickOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  pickText: { fontFamily: fonts.bodyMedium, fontSize: 14, color: colors.ink },
  pickTextOn: { color: colors.onInk },
  error: { ...type.small, color: colors.danger },
});
