import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { CharacterDetail } from '../../schemas/characters';
import { formatLength, isUnitScale } from '../../engine/rig/skeleton-scale';
import { colors, radius, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import { Button } from '../ui/Button';
import { TextField } from '../ui/TextField';

const UNIT_WORD = { metres: 'metres', centimetres: 'centimetres', millimetres: 'millimetres' } as const;

/**
 * The character's size in metres and the unit fix: one tap to scale a file authored in centimetres or millimetres,
 * a custom factor, or undo. The uploaded file is never changed; the fix is stored with the character.
 */
export function UnitFix({ detail, mayEdit, set }: { detail: CharacterDetail; mayEdit: boolean; set: Mutation<number> }) {
  const { character, report } = detail;
  const [custom, setCustom] = useState('');
  const [customError, setCustomError] = useState<string | null>(null);
  const guess = report.units?.guess ?? null;
  const fixed = character.unitScale !== 1;
  if (!guess && !fixed) return null;

  const applyCustom = () => {
    const value = Number(custom.replace(',', '.'));
    if (!custom.trim() || !isUnitScale(value)) {
      setCustomError('Enter a factor between 0.0001 and 10000, e.g. 0.0254 for inches.');
      return;
    }
    setCustomError(null);
    set.mutate(value);
  };
  const fieldError = set.error?.fields?.unitScale ?? customError ?? undefined;

  return (
    <View style={[styles.box, fixed ? styles.done : guess?.certainty === 'likely' ? styles.warn : styles.info]} aria-label="Unit of the file">
      {fixed ? (
        <>
          <Text style={styles.title}>Scaled by {character.unitScale} to metres</Text>
          <Text style={styles.body}>
            The skeleton is {formatLength(report.stats.height * character.unitScale)} tall. Trials, this view, the leg profile and the runtime all use the
            scale; the uploaded file is kept as it came.
          </Text>
          {mayEdit ? <Button label="Undo the scale" tone="quiet" busy={set.isPending} onPress={() => set.mutate(1)} /> : null}
        </>
      ) : guess ? (
        <>
          <Text style={styles.title}>
            {guess.certainty === 'likely' ? `This file looks authored in ${UNIT_WORD[guess.unit]}` : `Authored in ${UNIT_WORD[guess.unit]}?`}
          </Text>
          <Text style={styles.body}>
            Read as metres, as glTF defines them, the skeleton is {formatLength(report.stats.height)} tall; in {UNIT_WORD[guess.unit]} it is {formatLength(guess.metres)}. Scaling keeps the
            uploaded file as it is.
          </Text>
          {mayEdit ? (
            <View style={styles.actions}>
              <Button label={`Scale by ${guess.factor} (${UNIT_WORD[guess.unit]} to metres)`} busy={set.isPending} onPress={() => set.mutate(guess.factor)} />
              <View style={styles.custom}>
                <View style={styles.field}>
                  <TextField label="Other factor" value={custom} onChangeText={setCustom} inputMode="decimal" placeholder="e.g. 0.0254" error={fieldError} />
                </View>
                <Button label="Scale" tone="quiet" disabled={set.isPending} onPress={applyCustom} />
              </View>
            </View>
          ) : (
            <Text style={styles.body}>An owner or designer can scale it.</Text>
          )}
        </>
      ) : null}
      {set.error && !set.error.fields?.unitScale ? <Text style={styles.problem} role="alert">{set.error.message}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.md, padding: space.lg, gap: space.sm, borderLeftWidth: 4 },
  warn: { backgroundColor: '#FBEFD9', borderLeftColor: '#D99A1E' },
  info: { backgroundColor: colors.paperDeep, borderLeftColor: colors.graphite },
  done: { backgroundColor: colors.paperDeep, borderLeftColor: colors.moss },
  title: { ...type.label, fontSize: 16, color: colors.ink },
  body: { ...type.small, color: colors.ink },
  actions: { gap: space.md, flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end' },
  custom: { flexDirection: 'row', alignItems: 'flex-end', gap: space.sm, flexGrow: 1, flexBasis: 220, minWidth: 0 },
  field: { flex: 1, minWidth: 0 },
  problem: { ...type.small, color: colors.danger },
});
