import { StyleSheet, View } from 'react-native';
import type { Brush } from '../../engine/course/brushes';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ChoiceRow } from './ChoiceRow';
import { space } from '../../constants/theme';

export type BrushSettings = Pick<Brush, 'kind' | 'radius' | 'strength'>;

const KINDS = [
  { value: 'raise', label: 'Raise' },
  { value: 'lower', label: 'Lower' },
  { value: 'smooth', label: 'Smooth' },
  { value: 'flatten', label: 'Flatten' },
] as const;
const RADII = ['0.1', '0.2', '0.35', '0.6'] as const;
const STRENGTHS = ['0.25', '0.5', '1'] as const;
const STRENGTH_CHOICES = STRENGTHS.map((s) => ({ value: s, label: s === '1' ? 'Full' : `${Number(s) * 100}%` }));

/** Which brush, how wide (metres) and how strong (0–1 of its full effect per dab). */
export function BrushBar({
  value,
  onChange,
  disabled,
  compact = false,
}: {
  value: BrushSettings;
  onChange(b: BrushSettings): void;
  disabled?: boolean;
  /** The phone's strip above the map: the same controls, one line each. */
  compact?: boolean;
}) {
  if (compact) {
    return (
      <View style={styles.barCompact} testID="brush-bar">
        <ChoiceRow label="Brush" showLabel={false} choices={KINDS} value={value.kind} onChange={(kind) => onChange({ ...value, kind })} disabled={disabled} />
        <ChoiceRow label="Radius" choices={RADII.map((r) => ({ value: r, label: `${r} m` }))} value={RADII.find((r) => Number(r) === value.radius)} onChange={(r) => onChange({ ...value, radius: Number(r) })} disabled={disabled} />
        <ChoiceRow label="Strength" choices={STRENGTH_CHOICES} value={STRENGTHS.find((s) => Number(s) === value.strength)} onChange={(s) => onChange({ ...value, strength: Number(s) })} disabled={disabled} />
      </View>
    );
  }
  return (
    <View style={styles.bar} testID="brush-bar">
      <ChoiceChips label="Brush" choices={KINDS} value={value.kind} onChange={(kind) => onChange({ ...value, kind })} disabled={disabled} />
      <View style={styles.pair}>
        <ChoiceChips
          label="Radius"
          choices={RADII.map((r) => ({ value: r, label: `${r} m` }))}
          value={RADII.find((r) => Number(r) === value.radius)}
          onChange={(r) => onChange({ ...value, radius: Number(r) })}
          disabled={disabled}
        />
        <ChoiceChips
          label="Strength"
          choices={STRENGTH_CHOICES}
          value={STRENGTHS.find((s) => Number(s) === value.strength)}
          onChange={(s) => onChange({ ...value, strength: Number(s) })}
          disabled={disabled}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { gap: space.md },
  barCompact: { gap: 6 },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
});
