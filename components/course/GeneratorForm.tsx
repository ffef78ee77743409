import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { generateCourse } from '../../engine/course/generators';
import { heightRange, type Heightfield } from '../../engine/course/heightfield';
import { courseCreateSchema, courseGeneratorSchema, STORED_COURSE_LIMITS, type CourseCreateInput, type CourseDetail } from '../../schemas/courses';
import { fieldMessages } from '../../schemas/errors';
import { ApiError } from '../../hooks/api';
import { colors, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { HeightMap } from './HeightMap';
import { SideProfile } from './SideProfile';
import { courseFrame } from './frame';
import { rampRange } from './ramp';
import {
  formFieldErrors,
  initialDraft,
  KIND_DEFAULTS,
  KIND_FIELDS,
  KIND_LABELS,
  recipeOf,
  type GeneratorDraft,
  type SegmentKind,
} from './generatorFields';

const KINDS = (Object.keys(KIND_LABELS) as SegmentKind[]).map((k) => ({ value: k, label: KIND_LABELS[k] }));
const MAX_SEGMENTS = 12;

type Preview = { hf: Heightfield; lo: number; hi: number } | { problem: string };

/** Builds the preview as typed: the same engine generator the server runs, on this device. */
function previewOf(draft: GeneratorDraft): Preview {
  const parsed = courseGeneratorSchema.safeParse(recipeOf(draft));
  if (!parsed.success) return { problem: 'Fix the marked fields to see the preview.' };
  const r = parsed.data;
  const length = r.segments.reduce((s, seg) => s + (seg.kind === 'stairs' ? seg.steps * seg.tread : seg.length), 0);
  const cells = (Math.ceil(r.width / r.cellSize) + 1) * (Math.ceil(length / r.cellSize) + 1);
  if (cells > STORED_COURSE_LIMITS.maxCells) return { problem: `That makes about ${cells.toLocaleString('en')} samples; a course holds at most ${STORED_COURSE_LIMITS.maxCells.toLocaleString('en')}. Use larger cells.` };
  try {
    const hf = generateCourse(r);
    const { min, max } = heightRange(hf);
    return { hf, ...rampRange(min, max) };
  } catch (err) {
    return { problem: (err as Error).message.replace(/^invalid course spec:\s*/, '') };
  }
}

/** "New course": generator segments laid end to end, each with its parameters, and a live preview. */
export function GeneratorForm({ onCreate, onCancel }: { onCreate(input: CourseCreateInput): Promise<CourseDetail>; onCancel(): void }) {
  const [draft, setDraft] = useState<GeneratorDraft>(initialDraft);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [previewWidth, setPreviewWidth] = useState(0);
  const preview = useMemo(() => previewOf(draft), [draft]);

  function change(next: GeneratorDraft, clear: string) {
    setDraft(next);
    if (errors[clear]) setErrors(({ [clear]: _gone, ...rest }) => rest);
  }

  function setSegment(i: number, kind: SegmentKind, values: Record<string, string>) {
    const segments = draft.segments.map((s, k) => (k === i ? { kind, values } : s));
    setDraft({ ...draft, segments });
  }

  async function submit() {
    const input = { name: draft.name, generator: recipeOf(draft) };
    const checked = courseCreateSchema.safeParse(input);
    if (!checked.success) {
      setErrors(formFieldErrors(fieldMessages(checked.error.issues)));
      return;
    }
    setBusy(true);
    setFormError(null);
    try {
      await onCreate(input);
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(formFieldErrors(err.fields));
      else setFormError(err instanceof Error ? err.message : 'The course could not be made. Try again.');
    } finally {
      setBusy(false);
    }
  }

  const frame = 'hf' in preview && previewWidth ? courseFrame(preview.hf, 'right', previewWidth, 150) : null;

  return (
    <Card>
      <Text role="heading" aria-level={2} style={styles.heading}>
        New course
      </Text>
      <TextField label="Name" value={draft.name} onChangeText={(name) => change({ ...draft, name }, 'name')} error={errors.name} placeholder="e.g. Gantry stairs" />
      <View style={styles.row}>
        <View style={styles.cell}>
          <TextField label="Width across (m)" value={draft.width} inputMode="decimal" onChangeText={(width) => change({ ...draft, width }, 'width')} error={errors.width} />
        </View>
        <View style={styles.cell}>
          <TextField label="Cell size (m)" value={draft.cellSize} inputMode="decimal" onChangeText={(cellSize) => change({ ...draft, cellSize }, 'cellSize')} error={errors.cellSize} />
        </View>
      </View>

      {draft.segments.map((seg, i) => (
        <View key={i} style={styles.segment} aria-label={`Segment ${i + 1}`}>
          <ChoiceChips
            label={`Segment ${i + 1}`}
            choices={KINDS}
            value={seg.kind}
            onChange={(kind) => setSegment(i, kind, { ...KIND_DEFAULTS[kind], ...(seg.values.length && 'length' in KIND_DEFAULTS[kind] ? { length: seg.values.length } : {}) })}
          />
          <View style={styles.row}>
            {KIND_FIELDS[seg.kind].map((f) => {
              const key = `segments.${i}.${f.key}`;
              return (
                <View key={f.key} style={styles.cell}>
                  {f.choices ? (
                    <ChoiceChips label={f.label} choices={f.choices} value={seg.values[f.key]} onChange={(v) => setSegment(i, seg.kind, { ...seg.values, [f.key]: v })} error={errors[key]} />
                  ) : (
                    <TextField
                      label={f.unit ? `${f.label} (${f.unit})` : f.label}
                      nativeID={`seg-${i}-${f.key}`}
                      value={seg.values[f.key] ?? ''}
                      inputMode="decimal"
                      onChangeText={(v) => {
                        setSegment(i, seg.kind, { ...seg.values, [f.key]: v });
                        if (errors[key]) setErrors(({ [key]: _gone, ...rest }) => rest);
                      }}
                      error={errors[key]}
                    />
                  )}
                </View>
              );
            })}
          </View>
          {draft.segments.length > 1 ? (
            <View style={styles.segmentActions}>
              <Button label={`Remove segment ${i + 1}`} tone="quiet" onPress={() => setDraft({ ...draft, segments: draft.segments.filter((_, k) => k !== i) })} />
            </View>
          ) : null}
        </View>
      ))}
      {errors.segments ? <Notice message={errors.segments} /> : null}
      {draft.segments.length < MAX_SEGMENTS ? (
        <Button label="Add segment" tone="quiet" onPress={() => setDraft({ ...draft, segments: [...draft.segments, { kind: 'flat', values: { ...KIND_DEFAULTS.flat } }] })} />
      ) : null}

      <View style={styles.preview} onLayout={(e) => setPreviewWidth(Math.floor(e.nativeEvent.layout.width))}>
        <Text style={styles.label}>Preview</Text>
        {'problem' in preview ? <Text style={styles.muted}>{preview.problem}</Text> : null}
        {'hf' in preview && frame ? (
          <>
            <HeightMap hf={preview.hf} frame={frame} revision={0} lo={preview.lo} hi={preview.hi} label="Preview of the new course from above" />
            <SideProfile hf={preview.hf} frame={frame} revision={0} depth={110} />
          </>
        ) : null}
      </View>

      {errors._ ? <Notice message={errors._} /> : null}
      {formError ? <Notice message={formError} /> : null}
      <View style={styles.row}>
        <Button label="Make course" busy={busy} onPress={submit} />
        <Button label="Cancel" tone="quiet" onPress={onCancel} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  heading: { ...type.heading, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 140 },
  segment: { gap: space.sm, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colors.rule },
  segmentActions: { flexDirection: 'row' },
  preview: { gap: space.sm },
  label: { ...type.label, color: colors.ink },
  muted: { ...type.small, color: colors.graphite },
});
