import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { PreviewCourse } from '../../hooks/usePreviewCourse';
import { space } from '../../constants/theme';
import { LivePreview } from '../preview/LivePreview';
import { ChipGroup } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { DriveView } from './DriveView';

type Mode = 'watch' | 'drive';
const MODES = [
  { value: 'watch', label: 'Watch' },
  { value: 'drive', label: 'Drive' },
] as const;

/** The leg setup's preview: watch the walk go by itself, or drive it yourself with the stick or keys. */
export function PreviewOrDrive({ rig, setup, problem, ground, compact = false }: { rig: Rig; setup: LegSetup | null; problem: string | null; ground: PreviewCourse; compact?: boolean }) {
  const [mode, setMode] = useState<Mode>('watch');
  return (
    <View style={styles.wrap}>
      <ChipGroup<Mode> label="Preview mode" choices={MODES} value={mode} onChange={setMode} compact={compact} />
      {mode === 'watch' ? (
        <LivePreview rig={rig} setup={setup} problem={problem} ground={ground} compact={compact} />
      ) : setup ? (
        <>
          <DriveView rig={rig} setup={setup} ground={ground} compact={compact} />
          {problem ? <Notice tone="info" message={`Driving the last valid settings: ${problem}`} /> : null}
        </>
      ) : (
        <Notice tone="info" message="Drive needs settings the engine accepts; see the messages in the form." />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
});
