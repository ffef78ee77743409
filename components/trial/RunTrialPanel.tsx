import { useEffect, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { TrialJobResult } from '../../schemas/trials';
import { colors, space, type } from '../../constants/theme';
import type { TrialRunner } from '../../hooks/useTrialRunner';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { ProgressBar } from './ProgressBar';

/**
 * Run a trial as a background job: pick a course or a suite, start, watch the progress bar (the job is
 * polled through React Query), then open the stored trial. The screen holds the `runner` (useTrialRunner).
 */
export function RunTrialPanel({
  characterId,
  legSetupId,
  legSetup,
  initialCourseId,
  onFieldErrors,
  runner,
  blockedBy,
}: {
  runner: TrialRunner;
  characterId: number;
  legSetupId?: number;
  legSetup?: LegSetup;
  initialCourseId?: number | null;
  /** A refusal's field messages (a setting that stops the trial), for the form to show beside its fields. */
  onFieldErrors?: (fields: Record<string, string>) => void;
  /** Why the trial cannot start yet (the form beside it has settings that need attention); the button waits. */
  blockedBy?: string | null;
}) {
  const router = useRouter();
  const [target, setTarget] = useState<string | undefined>(initialCourseId ? `course:${initialCourseId}` : undefined);
  const { courses, suites, run, setJobId, job } = runner;
  const choices = [
    ...(courses.data?.courses ?? []).map((c) => ({ value: `course:${c.id}`, label: c.name })),
    ...(suites.data?.suites ?? []).map((s) => ({ value: `suite:${s.id}`, label: `Suite: ${s.name}` })),
  ];
  useEffect(() => {
    if (!target && choices.length) setTarget(choices[0].value);
  }, [target, choices.length]);
  const status = job.data?.status;
  const result = status === 'done' ? (job.data?.result as TrialJobResult | undefined) : undefined;

  async function start() {
    if (!target || blockedBy) return;
    const [kind, id] = target.split(':');
    const body = { characterId, ...(kind === 'course' ? { courseId: Number(id) } : { suiteId: Number(id) }), ...(legSetup ? { legSetup } : legSetupId ? { legSetupId } : {}) };
    const accepted = await run.mutateAsync(body).catch((err) => {
      onFieldErrors?.((err as { fields?: Record<string, string> }).fields ?? {});
      return null;
    });
    if (accepted) setJobId(accepted.job.id);
  }

  return (
    <View style={styles.wrap} testID="run-trial">
      <ChoiceChips label="Walk over" choices={choices} value={target} onChange={setTarget} />
      <Button label={status === 'queued' || status === 'running' ? 'Running…' : 'Run trial'} onPress={start} busy={run.isPending} disabled={!target || !!blockedBy || status === 'queued' || status === 'running'} />
      {blockedBy ? <Notice tone="info" message={blockedBy} /> : null}
      {run.error ? <Notice message={run.error.message} /> : null}
      {job.data ? <ProgressBar progress={job.data.progress} label={status === 'queued' ? 'Waiting for a free worker' : status === 'done' ? 'Trial finished' : 'Walking the course'} /> : null}
      {status === 'failed' ? <Notice message={job.data?.error ?? 'The trial failed.'} /> : null}
      {status === 'cancelled' ? <Notice tone="info" message="The trial was cancelled." /> : null}
      {result ? (
        <View style={styles.done}>
          <Text style={styles.doneText}>
            Footing score <Text style={styles.fig}>{result.footingScore.toFixed(1)}</Text> over {result.trialIds.length} {result.trialIds.length === 1 ? 'course' : 'courses'}.
          </Text>
          <Button tone="quiet" label="Open the trial" onPress={() => router.push(`/trials/${result.trialIds[0]}`)} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  done: { gap: space.sm },
  doneText: { ...type.body, color: colors.ink },
  fig: { fontFamily: 'IBMPlexMono_500Medium' },
});
