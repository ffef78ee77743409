import { useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { nameOf } from '../../engine/gait/setting-sentences';
import { colors, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { TextField } from '../ui/TextField';
import { jsonOf, overridesOf, rowUnit, rowsOf, type LimitLeg, type LimitRow } from './limit-rows';

export type { LimitLeg } from './limit-rows';

/**
 * Per-leg joint limit overrides as rows: leg, joint, min, max, typed in degrees (as on the legs page) and kept
 * as text while typed, so "-" or "1." survive a keystroke; the setup gets radians.
 */
export function LegLimitsEditor({ value, onChange, legs, errors, disabled }: { value: string; onChange(json: string): void; legs: LimitLeg[]; errors: Record<string, string>; disabled?: boolean }) {
  const [rows, setRows] = useState<LimitRow[]>(() => rowsOf(value, legs));
  const sent = useRef(value);
  // A version loaded into the form (or a reset) replaces what is typed here.
  if (value !== sent.current) {
    sent.current = value;
    const fresh = rowsOf(value, legs);
    if (jsonOf(fresh, legs, value) !== jsonOf(rows, legs, value)) setRows(fresh);
  }
  const commit = (next: LimitRow[]) => {
    setRows(next);
    sent.current = jsonOf(next, legs, sent.current);
    onChange(sent.current);
  };
  // Set outside this form (an import or an older editor); kept as saved, and said so.
  const ownSolver = overridesOf(value).filter((o) => o.solver && Object.keys(o.solver).length);
  const update = (i: number, patch: Partial<LimitRow>) => commit(rows.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const legErrors = Object.entries(errors).filter(([k]) => k.startsWith('legs'));
  return (
    <View style={styles.wrap}>
      {rows.map((r, i) => {
        const leg = legs.find((l) => l.name === r.leg) ?? legs[0];
        const unit = rowUnit(legs, r);
        return (
          <View key={i} style={styles.row}>
            <ChoiceChips label="Leg" choices={legs.map((l) => ({ value: l.name, label: l.name }))} value={r.leg} onChange={(v) => update(i, { leg: v, joint: legs.find((l) => l.name === v)?.joints[0]?.name ?? '' })} disabled={disabled} />
            <ChoiceChips label="Joint" choices={(leg?.joints ?? []).map((j) => ({ value: j.name, label: j.name }))} value={r.joint} onChange={(v) => update(i, { joint: v })} disabled={disabled} />
            <View style={styles.pair}>
              <View style={styles.cell}>
                <TextField label={`Min (${unit})`} value={r.min} onChangeText={(v) => update(i, { min: v })} inputMode="decimal" editable={!disabled} />
              </View>
              <View style={styles.cell}>
                <TextField label={`Max (${unit})`} value={r.max} onChangeText={(v) => update(i, { max: v })} inputMode="decimal" editable={!disabled} />
              </View>
            </View>
            <Button tone="danger" label="Remove this limit" onPress={() => commit(rows.filter((_, k) => k !== i))} disabled={disabled} />
          </View>
        );
      })}
      {ownSolver.map((o) => (
        <Text key={o.leg} style={styles.note}>
          {o.leg} has its own solver settings, kept as saved: {Object.keys(o.solver ?? {}).map((k) => nameOf(`solver.${k}`).label).join(', ')}.
        </Text>
      ))}
      {legErrors.map(([k, m]) => (
        <Text key={k} style={styles.error}>
          {k}: {m}
        </Text>
      ))}
      <Button
        tone="quiet"
        label="Add a joint limit"
        onPress={() => {
          const first = legs[0];
          if (!first) return;
          const joint = first.joints[0];
          commit([...rows, { leg: first.name, joint: joint?.name ?? '', dof: '0', min: joint?.slider ? '-0.1' : '-45', max: joint?.slider ? '0.1' : '45' }]);
        }}
        disabled={disabled || legs.length === 0}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  row: { gap: space.sm, paddingBottom: space.md, borderBottomWidth: 1, borderColor: colors.rule },
  pair: { flexDirection: 'row', gap: space.md },
  cell: { flex: 1 },
  error: { ...type.small, color: colors.danger },
  note: { ...type.small, color: colors.graphite },
});
