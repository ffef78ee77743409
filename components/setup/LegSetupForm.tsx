import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { GAIT_PATTERNS } from '../../engine/gait/patterns';
import { SOLVER_METHODS } from '../../engine/ik/options';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { ChoiceChips } from '../ui/ChoiceChips';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';
import { Notice } from '../ui/Notice';
import { Button } from '../ui/Button';
import { BODY_FIELDS, FOOTHOLD_FIELDS, GAIT_FIELDS, SOLVER_FIELDS, isJacobianMethod, settingLabel, solverFieldsFor, type Draft, type NumberField } from './setup-draft';
import { LegLimitsEditor, type LimitLeg } from './LegLimitsEditor';
import { SOLVER_METHOD_NAMES, SOLVER_METHOD_NOTES, gaitName } from './names';

const METHOD_CHOICES = SOLVER_METHODS.map((m) => ({ value: m, label: SOLVER_METHOD_NAMES[m] }));
const GAIT_CHOICES = GAIT_PATTERNS.map((g) => ({ value: g, label: gaitName(g) }));
const YES_NO = [
  { value: 'true', label: 'on' },
  { value: 'false', label: 'off' },
];

/**
 * Every engine setting of a leg setup as a field, those of the chosen solver method only; messages come from
 * the shared LegSetupSchema. Angles are typed in degrees (the form converts to the setup's radians). The
 * foothold weights are folded away until asked for (or until one of them needs attention).
 */
export function LegSetupForm({ draft, errors, onChange, legs, disabled }: { draft: Draft; errors: Record<string, string>; onChange(path: string, value: string): void; legs: LimitLeg[]; disabled?: boolean }) {
  const wide = useIsWide();
  const [footholdsOpen, setFootholdsOpen] = useState(false);
  const footholdProblem = FOOTHOLD_FIELDS.some((f) => errors[f.path]);
  const method = draft['solver.method'];
  const shown = solverFieldsFor(method, draft['solver.footOrientation'] === 'true');
  const jacobian = isJacobianMethod(method);
  // A setting the chosen method does not read can still be out of range (from an older version): say which.
  const hiddenProblems = SOLVER_FIELDS.filter((f) => !shown.includes(f) && errors[f.path]).map((f) => `${f.label}: ${errors[f.path]}`);
  const numbers = (fields: NumberField[]) => (
    <View style={[styles.fields, wide && styles.fieldsWide]}>
      {fields.map((f) => (
        <View key={f.path} style={wide ? styles.half : undefined}>
          <TextField
            label={f.unit ? `${f.label} (${f.unit})` : f.label}
            hint={f.nullable}
            value={draft[f.path]}
            onChangeText={(v) => onChange(f.path, v)}
            error={errors[f.path]}
            inputMode={f.integer ? 'numeric' : 'decimal'}
            editable={!disabled}
            nativeID={`setup-${f.path.replace(/\./g, '-')}`}
          />
        </View>
      ))}
    </View>
  );
  return (
    <View style={styles.wrap}>
      <SectionHeading>Solver</SectionHeading>
      <ChoiceChips label={settingLabel('solver.method')} choices={METHOD_CHOICES} value={method} onChange={(v) => onChange('solver.method', v)} error={errors['solver.method']} disabled={disabled} />
      {method in SOLVER_METHOD_NOTES ? <Text style={styles.note}>{SOLVER_METHOD_NOTES[method as keyof typeof SOLVER_METHOD_NOTES]}</Text> : null}
      {method === 'adaptive' ? (
        <ChoiceChips label="Adaptive damping from" choices={[{ value: 'manipulability', label: 'nearness to full stretch' }, { value: 'error', label: 'size of the error' }]} value={draft['solver.adaptiveMode']} onChange={(v) => onChange('solver.adaptiveMode', v)} disabled={disabled} />
      ) : null}
      <ChoiceChips label="Turn the sole to the ground" choices={YES_NO} value={draft['solver.footOrientation']} onChange={(v) => onChange('solver.footOrientation', v)} disabled={disabled} />
      <View testID="solver-fields">{numbers(shown)}</View>
      {hiddenProblems.length ? <Notice message={`Settings another method reads need attention: ${hiddenProblems.join('; ')}`} /> : null}
      <ChoiceChips label="Warm start" choices={[{ value: 'previous', label: 'last pose' }, { value: 'extrapolate', label: 'carried on' }]} value={draft['solver.warmStart']} onChange={(v) => onChange('solver.warmStart', v)} disabled={disabled} />
      {jacobian ? (
        <>
          <ChoiceChips label="Re-solve joints at their limits" choices={YES_NO} value={draft['solver.resolveSaturated']} onChange={(v) => onChange('solver.resolveSaturated', v)} disabled={disabled} />
          <ChoiceChips label="Null-space bias" choices={[{ value: 'none', label: 'none' }, { value: 'rest', label: 'toward rest pose' }]} value={draft['solver.nullSpace.kind']} onChange={(v) => onChange('solver.nullSpace.kind', v)} disabled={disabled} />
        </>
      ) : null}
      {jacobian && draft['solver.nullSpace.kind'] === 'rest' ? (
        <TextField label="Null-space gain (0–1)" value={draft['solver.nullSpace.gain']} onChangeText={(v) => onChange('solver.nullSpace.gain', v)} error={errors['solver.nullSpace.gain']} inputMode="decimal" editable={!disabled} />
      ) : null}

      <SectionHeading>Gait</SectionHeading>
      <ChoiceChips label={settingLabel('gait.pattern')} choices={GAIT_CHOICES} value={draft['gait.pattern']} onChange={(v) => onChange('gait.pattern', v)} error={errors['gait.pattern']} disabled={disabled} />
      <TextField
        label={settingLabel('gait.phaseOffsets', 'touchdown as a share of the cycle, one per leg')}
        hint={`blank = the pattern's; legs in order: ${legs.map((l) => l.name).join(', ')}`}
        value={draft['gait.phaseOffsets']}
        onChangeText={(v) => onChange('gait.phaseOffsets', v)}
        error={errors['gait.phaseOffsets'] ?? Object.entries(errors).find(([k]) => k.startsWith('gait.phaseOffsets.'))?.[1]}
        editable={!disabled}
      />
      <ChoiceChips label="Timing" choices={[{ value: 'speed', label: 'by speed' }, { value: 'cycle', label: 'by cycle time' }]} value={draft['gait.timing.mode']} onChange={(v) => onChange('gait.timing.mode', v)} disabled={disabled} />
      <TextField label={settingLabel(draft['gait.timing.mode'] === 'speed' ? 'gait.timing.speed' : 'gait.timing.cycleTime')} value={draft['gait.timing.value']} onChangeText={(v) => onChange('gait.timing.value', v)} error={errors['gait.timing.value']} inputMode="decimal" editable={!disabled} />
      {numbers(GAIT_FIELDS)}

      <SectionHeading>Body</SectionHeading>
      {numbers(BODY_FIELDS)}

      <SectionHeading>Footholds</SectionHeading>
      <Text style={styles.note}>How the walk picks where a foot lands: the spots it weighs around the planned one, and what counts against a spot.</Text>
      {footholdsOpen || footholdProblem ? (
        <View testID="foothold-fields">{numbers(FOOTHOLD_FIELDS)}</View>
      ) : null}
      {footholdProblem ? null : (
        <View style={styles.toggle}>
          <Button tone="quiet" label={footholdsOpen ? 'Hide the foothold settings' : 'Show the foothold settings'} aria-expanded={footholdsOpen} onPress={() => setFootholdsOpen((o) => !o)} />
        </View>
      )}

      <SectionHeading>Limits per leg</SectionHeading>
      <Text style={styles.note}>Joint limits that replace the mapped ones for one leg (degrees; metres for sliders).</Text>
      <LegLimitsEditor value={draft.legs} onChange={(v) => onChange('legs', v)} legs={legs} errors={errors} disabled={disabled} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  fields: { gap: space.md },
  fieldsWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  half: { flexBasis: '47%', flexGrow: 1 },
  note: { ...type.small, color: colors.graphite },
  toggle: { alignItems: 'flex-start' },
});
