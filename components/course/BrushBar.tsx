import { StyleSheet, View } from 'react-native';
import type { Brush } from '../../engine/course/brushes';
import { ChoiceChips } from '../ui/ChoiceChips';
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

/** Which brush, how wide (metres) and how strong (0–1 of its full effect per dab). */
export function BrushBar({
  value,
  onChange,
  disabled,
  part = 'all',
}: {
  value: BrushSettings;
  onChange(b: BrushSettings): void;
  disabled?: boolean;
  /** A phone shows the brush kind above the map and its size below it. */
  part?: 'all' | 'kind' | 'size';
}) {
  return (
    <View style={styles.bar}>
      {part !== 'size' ? <ChoiceChips label="Brush" choices={KINDS} value={value.kind} onChange={(kind) => onChange({ ...value, kind })} disabled={disabled} /> : null}
      {part !== 'kind' ? (
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
          choices={STRENGTHS.map((s) => ({ value: s, label: s === '1' ? 'Full' : `${Number(s) * 100}%` }))}
          value={STRENGTHS.find((s) => Number(s) === value.strength)}
          onChange={(s) => onChange({ ...value, strength: Number(s) })}
          disabled={disabled}
        />
      </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { gap: space.md },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
});
