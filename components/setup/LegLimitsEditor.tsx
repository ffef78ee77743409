import { useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { LegOverride } from '../../engine/gait/leg-setup';
import { colors, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { TextField } from '../ui/TextField';
import { DEG_PER_RAD, roundedText } from './setup-draft';

/** A leg as the editor needs it: its joints, and which of them slide (metres) rather than turn (degrees). */
export interface LimitLeg {
  name: string;
  joints: { name: string; slider: boolean }[];
}

type Row = { leg: string; joint: string; dof: string; min: string; max: string };

const isSlider = (legs: LimitLeg[], leg: string, joint: string) => !!legs.find((l) => l.name === leg)?.joints.find((j) => j.name === joint)?.slider;

/** Rows as typed: degrees for turning joints, metres for sliders. */
function rowsOf(json: string, legs: LimitLeg[]): Row[] {
  try {
    const parsed = JSON.parse(json || '[]') as LegOverride[];
    return parsed.flatMap((l) =>
      l.limits.map((lim) => {
        const scale = isSlider(legs, l.leg, lim.joint) ? 1 : DEG_PER_RAD;
        return { leg: l.leg, joint: lim.joint, dof: String(lim.dof ?? 0), min: roundedText(lim.min * scale), max: roundedText(lim.max * scale) };
      }),
    );
  } catch {
    return [];
  }
}

/** The setup's JSON (radians for turning joints); a blank or broken number becomes NaN, which the schema refuses. */
function jsonOf(rows: Row[], legs: LimitLeg[]): string {
  const byLeg = new Map<string, { joint: string; dof: number; min: number | null; max: number | null }[]>();
  const num = (t: string, scale: number) => (t.trim() === '' || !Number.isFinite(Number(t)) ? null : Number(t) / scale);
  for (const r of rows) {
    const scale = isSlider(legs, r.leg, r.joint) ? 1 : DEG_PER_RAD;
    const list = byLeg.get(r.leg) ?? [];
    list.push({ joint: r.joint, dof: Number(r.dof), min: num(r.min, scale), max: num(r.max, scale) });
    byLeg.set(r.leg, list);
  }
  return JSON.stringify([...byLeg].map(([leg, limits]) => ({ leg, limits })));
}

/**
 * Per-leg joint limit overrides as rows: leg, joint, min, max, typed in degrees (as on the legs page) and kept
 * as text while typed, so "-" or "1." survive a keystroke; the setup gets radians.
 */
export function LegLimitsEditor({ value, onChange, legs, errors, disabled }: { value: string; onChange(json: string): void; legs: LimitLeg[]; errors: Record<string, string>; disabled?: boolean }) {
  const [rows, setRows] = useState<Row[]>(() => rowsOf(value, legs));
  const sent = useRef(value);
  // A version loaded into the form (or a reset) replaces what is typed here.
  if (value !== sent.current) {
    sent.current = value;
    const fresh = rowsOf(value, legs);
    if (jsonOf(fresh, legs) !== jsonOf(rows, legs)) setRows(fresh);
  }
  const commit = (next: Row[]) => {
    setRows(next);
    sent.current = jsonOf(next, legs);
    onChange(sent.current);
  };
  const update = (i: number, patch: Partial<Row>) => commit(rows.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const legErrors = Object.entries(errors).filter(([k]) => k.startsWith('legs'));
  return (
    <View style={styles.wrap}>
      {rows.map((r, i) => {
        const leg = legs.find((l) => l.name === r.leg) ?? legs[0];
        const unit = isSlider(legs, r.leg, r.joint) ? 'm' : '°';
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
});
