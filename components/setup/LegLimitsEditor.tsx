import { StyleSheet, Text, View } from 'react-native';
import type { LegOverride } from '../../engine/gait/leg-setup';
import { colors, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { TextField } from '../ui/TextField';

type Row = { leg: string; joint: string; dof: string; min: string; max: string };

function rowsOf(json: string): Row[] {
  try {
    const legs = JSON.parse(json || '[]') as LegOverride[];
    return legs.flatMap((l) => l.limits.map((lim) => ({ leg: l.leg, joint: lim.joint, dof: String(lim.dof ?? 0), min: String(lim.min), max: String(lim.max) })));
  } catch {
    return [];
  }
}

function jsonOf(rows: Row[]): string {
  const byLeg = new Map<string, { joint: string; dof: number; min: number; max: number }[]>();
  for (const r of rows) {
    const list = byLeg.get(r.leg) ?? [];
    list.push({ joint: r.joint, dof: Number(r.dof), min: r.min.trim() === '' ? NaN : Number(r.min), max: r.max.trim() === '' ? NaN : Number(r.max) });
    byLeg.set(r.leg, list);
  }
  return JSON.stringify([...byLeg].map(([leg, limits]) => ({ leg, limits })));
}

/** Per-leg joint limit overrides as rows: leg, joint, DOF, min, max. */
export function LegLimitsEditor({ value, onChange, legs, errors, disabled }: { value: string; onChange(json: string): void; legs: { name: string; joints: string[] }[]; errors: Record<string, string>; disabled?: boolean }) {
  const rows = rowsOf(value);
  const update = (i: number, patch: Partial<Row>) => onChange(jsonOf(rows.map((r, k) => (k === i ? { ...r, ...patch } : r))));
  const legErrors = Object.entries(errors).filter(([k]) => k.startsWith('legs'));
  return (
    <View style={styles.wrap}>
      {rows.map((r, i) => {
        const leg = legs.find((l) => l.name === r.leg) ?? legs[0];
        return (
          <View key={i} style={styles.row}>
            <ChoiceChips label="Leg" choices={legs.map((l) => ({ value: l.name, label: l.name }))} value={r.leg} onChange={(v) => update(i, { leg: v, joint: legs.find((l) => l.name === v)?.joints[0] ?? '' })} disabled={disabled} />
            <ChoiceChips label="Joint" choices={(leg?.joints ?? []).map((j) => ({ value: j, label: j }))} value={r.joint} onChange={(v) => update(i, { joint: v })} disabled={disabled} />
            <View style={styles.pair}>
              <View style={styles.cell}>
                <TextField label="Min" value={r.min} onChangeText={(v) => update(i, { min: v })} inputMode="decimal" editable={!disabled} />
              </View>
              <View style={styles.cell}>
                <TextField label="Max" value={r.max} onChangeText={(v) => update(i, { max: v })} inputMode="decimal" editable={!disabled} />
              </View>
            </View>
            <Button tone="danger" label="Remove this limit" onPress={() => onChange(jsonOf(rows.filter((_, k) => k !== i)))} disabled={disabled} />
          </View>
        );
      })}
      {legErrors.map(([k, m]) => (
        <Text key={k} style={styles.error}>
          {k}: {m}
        </Text>
      ))}
      <Button tone="quiet" label="Add a joint limit" onPress={() => legs[0] && onChange(jsonOf([...rows, { leg: legs[0].name, joint: legs[0].joints[0] ?? '', dof: '0', min: '-1', max: '1' }]))} disabled={disabled || legs.length === 0} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  row: { gap: space.sm, paddingBottom: space.md, borderBottomWidth: 1, borderColor: colors.rule },
  pair: { flexDirection: 'row', gap: space.md },
  cell: { flex: 1 },
  error: { ...type.small, color: colors.danger },
});
