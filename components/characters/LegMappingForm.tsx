import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { legMappingUpdateSchema, type DetectedLeg, type LegDofKind, type LegMapping, type LegSide, type SkeletonJointSummary } from '../../schemas/characters';
import { fieldMessages } from '../../schemas/errors';
import { defaultLegJoint } from '../../engine/rig/skeleton-leg-dofs';
import { legMappingProblems } from '../../engine/rig/skeleton-leg-check';
import { legPath } from '../../engine/rig/detect-legs';
import { ApiError } from '../../hooks/api';
import { colors, radius, space, touchTarget, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { DOF_LABEL, toDegrees } from './format';

const SIDES = [
  { value: 'left', label: 'Left' },
  { value: 'right', label: 'Right' },
  { value: 'centre', label: 'Centre' },
] as const;
const DOFS = (Object.keys(DOF_LABEL) as LegDofKind[]).map((value) => ({ value, label: DOF_LABEL[value] }));
const RANGE_NAMES: Record<LegDofKind, string[]> = { ball: ['Swing', 'Twist'], hinge: ['Bend'], universal: ['Flex', 'Roll'], slider: ['Stroke'] };

/** Limits are edited in degrees (metres for a slider) and stored in radians. */
const shown = (dof: LegDofKind, v: number) => (dof === 'slider' ? v.toFixed(3) : String(Math.round(toDegrees(v) * 10) / 10));
const stored = (dof: LegDofKind, text: string) => {
  const n = Number(text.replace(',', '.').trim());
  if (text.trim() === '' || !Number.isFinite(n)) return NaN;
  return dof === 'slider' ? n : (n * Math.PI) / 180;
};

function JointStepper({ label, value, joints, onChange, error }: { label: string; value: number; joints: SkeletonJointSummary[]; onChange(j: number): void; error?: string }) {
  const step = (d: number) => onChange((value + d + joints.length) % joints.length);
  return (
    <View style={styles.stepperWrap}>
      <Text style={styles.smallLabel}>{label}</Text>
      <View style={styles.stepper}>
        <Pressable role="button" accessibilityLabel={`${label}: previous joint`} onPress={() => step(-1)} style={styles.stepButton}>
          <Text style={styles.stepText}>‹</Text>
        </Pressable>
        <Text style={styles.stepValue} numberOfLines={1}>
          {joints[value]?.name ?? `joint ${value}`}
        </Text>
        <Pressable role="button" accessibilityLabel={`${label}: next joint`} onPress={() => step(1)} style={styles.stepButton}>
          <Text style={styles.stepText}>›</Text>
        </Pressable>
      </View>
      {error ? (
        <Text role="alert" style={styles.error}>
          {error}
        </Text>
      ) : null}
    </View>
  );
}

/** Confirm or correct the legs: joints per leg, DOF kind and limits per joint; checked by the shared schema before it is sent. */
export function LegMappingForm({
  initial,
  detected,
  joints,
  onSave,
  onCancel,
}: {
  initial: LegMapping[];
  detected: DetectedLeg[];
  joints: SkeletonJointSummary[];
  onSave(legs: LegMapping[]): Promise<void>;
  onCancel(): void;
}) {
  const [legs, setLegs] = useState<LegMapping[]>(() => structuredClone(initial));
  const [drafts, setDrafts] = useState<Record<string, string>>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const positions = joints.flatMap((j) => j.position);

  const update = (l: number, change: (leg: LegMapping) => LegMapping) => setLegs((all) => all.map((leg, i) => (i === l ? change(structuredClone(leg)) : leg)));
  const draftKey = (l: number, k: number, r: number, end: 'min' | 'max') => `${l}.${k}.${r}.${end}`;

  /** The legs with every limit typed so far applied (NaN where a field does not hold a number). */
  function withDrafts(): LegMapping[] {
    return legs.map((leg, l) => ({
      ...leg,
      joints: leg.joints.map((j, k) => ({
        ...j,
        limits: j.limits.map((range, r) => ({
          min: draftKey(l, k, r, 'min') in drafts ? stored(j.dof, drafts[draftKey(l, k, r, 'min')]) : range.min,
          max: draftKey(l, k, r, 'max') in drafts ? stored(j.dof, drafts[draftKey(l, k, r, 'max')]) : range.max,
        })),
      })),
    }));
  }

  async function save() {
    setFormError(null);
    const candidate = withDrafts();
    const parsed = legMappingUpdateSchema.safeParse({ legs: candidate });
    const problems = parsed.success ? legMappingProblems({ joints: joints.map((j) => ({ name: j.name, parent: j.parent, translation: [0, 0, 0], rotation: [0, 0, 0, 1], scale: [1, 1, 1] })) }, parsed.data.legs) : fieldMessages(parsed.error.issues);
    if (!parsed.success || Object.keys(problems).length) {
      setErrors(problems);
      setFormError('Some legs need attention; the problems are shown beside them.');
      return;
    }
    setSaving(true);
    try {
      await onSave(parsed.data.legs);
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fields);
        setFormError(err.message);
      } else setFormError('Saving failed. Try again.');
    } finally {
      setSaving(false);
    }
  }

  return (
    <View style={styles.form}>
      {legs.map((leg, l) => (
        <View key={l} style={styles.leg} aria-label={`Leg ${l + 1}`}>
          <TextField label={`Leg ${l + 1} name`} value={leg.name} onChangeText={(name) => update(l, (x) => ({ ...x, name }))} error={errors[`legs.${l}.name`]} />
          <ChoiceChips label="Side" choices={SIDES} value={leg.side} onChange={(side: LegSide) => update(l, (x) => ({ ...x, side }))} />
          {leg.joints.map((j, k) => (
            <View key={k} style={styles.joint}>
              <JointStepper
                label={k === 0 ? 'Hip joint' : `Joint ${k + 1}`}
                value={j.joint}
                joints={joints}
                onChange={(joint) => update(l, (x) => ({ ...x, joints: x.joints.map((y, i) => (i === k ? { ...y, joint } : y)) }))}
                error={errors[`legs.${l}.joints.${k}.joint`]}
              />
              <ChoiceChips
                label="Kind"
                choices={DOFS}
                value={j.dof}
                onChange={(dof) =>
                  update(l, (x) => {
                    const path = legPath(x);
                    x.joints[k] = defaultLegJoint(positions, path, k, dof);
                    return x;
                  })
                }
                error={errors[`legs.${l}.joints.${k}.axes`] ?? errors[`legs.${l}.joints.${k}.limits`]}
              />
              {j.limits.map((range, r) => (
                <View key={r} style={styles.range}>
                  {(['min', 'max'] as const).map((end) => (
                    <View key={end} style={styles.rangeField}>
                      <TextField
                        label={`${RANGE_NAMES[j.dof][r]} ${end} (${j.dof === 'slider' ? 'm' : '°'})`}
                        value={drafts[draftKey(l, k, r, end)] ?? shown(j.dof, range[end])}
                        onChangeText={(text) => setDrafts((d) => ({ ...d, [draftKey(l, k, r, end)]: text }))}
                        keyboardType="numbers-and-punctuation"
                        error={errors[`legs.${l}.joints.${k}.limits.${r}.${end}`]}
                      />
                    </View>
                  ))}
                </View>
              ))}
            </View>
          ))}
          <JointStepper label="End joint (sole)" value={leg.end} joints={joints} onChange={(end) => update(l, (x) => ({ ...x, end }))} error={errors[`legs.${l}.end`]} />
          <Button label={`Remove ${leg.name || 'this leg'}`} tone="danger" onPress={() => setLegs((all) => all.filter((_, i) => i !== l))} />
        </View>
      ))}
      {errors.legs ? <Notice message={errors.legs} /> : null}
      {formError ? <Notice message={formError} /> : null}
      <View style={styles.actions}>
        <Button label="Save legs" onPress={save} busy={saving} />
        <Button
          label="Back to detected"
          tone="quiet"
          onPress={() => {
            setLegs(detected.map(({ name, side, joints: j, end }) => ({ name, side, joints: structuredClone(j), end })));
            setDrafts({});
            setErrors({});
          }}
        />
        <Button label="Cancel" tone="quiet" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  leg: { gap: space.md, borderWidth: 1, borderColor: colors.rule, borderRadius: radius.md, padding: space.md, backgroundColor: colors.card },
  joint: { gap: space.sm, borderLeftWidth: 2, borderLeftColor: colors.rule, paddingLeft: space.md },
  range: { flexDirection: 'row', gap: space.sm },
  rangeField: { flex: 1 },
  stepperWrap: { gap: space.xs },
  smallLabel: { ...type.label, color: colors.ink },
  stepper: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  stepButton: { width: touchTarget, height: touchTarget, alignItems: 'center', justifyContent: 'center', borderRadius: radius.md, borderWidth: 1.5, borderColor: colors.ink },
  stepText: { ...type.heading, color: colors.ink },
  stepValue: { ...type.figure, color: colors.ink, flex: 1 },
  error: { ...type.small, color: colors.danger },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
