import { useEffect, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { dialInRequestSchema, TUNABLE_SETTINGS, type DialInResult } from '../../schemas/dial-ins';
import { fieldMessages } from '../../schemas/errors';
import { colors, fonts, space, type } from '../../constants/theme';
import { useSuites } from '../../hooks/useCourses';
import { useAcceptDialIn, useStartDialIn } from '../../hooks/useDialIn';
import { cancelJob, useJob } from '../../hooks/useJobs';
import { useIsWide } from '../../hooks/useLayout';
import { LinePlot } from '../charts/LinePlot';
import { Screen } from '../layout/Screen';
import { ProgressBar } from '../trial/ProgressBar';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';
import { BeforeAfter } from './BeforeAfter';

type Bounds = Record<string, { on: boolean; min: string; max: string }>;

const initialBounds = (): Bounds =>
  Object.fromEntries(TUNABLE_SETTINGS.map((t, i) => [t.key, { on: i === 4 || t.key === 'body.heightOffset', min: String(t.suggested[0]), max: String(t.suggested[1]) }]));

/** Dial-in: what to tune and in which bounds, the suite, the budget; progress and best so far while it runs; before/after and accept. */
export function DialInPage({ characterId, characterName, mayRun }: { characterId: number; characterName: string; mayRun: boolean }) {
  const wide = useIsWide();
  const suites = useSuites();
  const [suiteId, setSuiteId] = useState<string | undefined>();
  const [bounds, setBounds] = useState<Bounds>(initialBounds);
  const [candidates, setCandidates] = useState('200');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [jobId, setJobId] = useState<number | null>(null);
  const start = useStartDialIn();
  const accept = useAcceptDialIn(characterId);
  const job = useJob(jobId);
  useEffect(() => {
    if (!suiteId && suites.data?.suites.length) setSuiteId(String(suites.data.suites[0].id));
  }, [suiteId, suites.data]);
  const result = job.data?.result as DialInResult | undefined;
  const running = job.data?.status === 'queued' || job.data?.status === 'running';
  const picked = TUNABLE_SETTINGS.filter((t) => bounds[t.key].on);

  async function onStart() {
    const body = {
      characterId,
      suiteId: Number(suiteId ?? 0),
      params: picked.map((t) => ({ key: t.key, min: Number(bounds[t.key].min), max: Number(bounds[t.key].max) })),
      candidates: Number(candidates),
      seed: 1,
    };
    const checked = dialInRequestSchema.safeParse(body);
    if (!checked.success) {
      setErrors(fieldMessages(checked.error.issues));
      return;
    }
    setErrors({});
    const accepted = await start.mutateAsync(body).catch((err) => {
      setErrors((err as { fields?: Record<string, string> }).fields ?? {});
      return null;
    });
    if (accepted) setJobId(accepted.job.id);
  }

  const fieldError = (key: string, part: 'min' | 'max') => {
    const i = picked.findIndex((t) => t.key === key);
    return i >= 0 ? errors[`params.${i}.${part}`] : undefined;
  };

  const setup = (
    <Card>
      <SectionHeading>What to tune</SectionHeading>
      {TUNABLE_SETTINGS.map((t) => (
        <View key={t.key} style={styles.param}>
          <ChoiceChips
            label={t.unit ? `${t.label} (${t.unit})` : t.label}
            choices={[{ value: 'on', label: 'tune' }, { value: 'off', label: 'keep' }]}
            value={bounds[t.key].on ? 'on' : 'off'}
            onChange={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], on: v === 'on' } }))}
            disabled={running}
          />
          {bounds[t.key].on ? (
            <View style={styles.pair}>
              <View style={styles.cell}>
                <TextField label="From" value={bounds[t.key].min} onChangeText={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], min: v } }))} error={fieldError(t.key, 'min')} inputMode="decimal" />
              </View>
              <View style={styles.cell}>
                <TextField label="To" value={bounds[t.key].max} onChangeText={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], max: v } }))} error={fieldError(t.key, 'max')} inputMode="decimal" />
              </View>
            </View>
          ) : null}
        </View>
      ))}
      {errors.params ? <Notice message={errors.params} /> : null}
      <ChoiceChips label="Suite" choices={(suites.data?.suites ?? []).map((s) => ({ value: String(s.id), label: s.name }))} value={suiteId} onChange={setSuiteId} error={errors.suiteId} />
      <TextField label="Budget (candidates; each is a trial per course)" value={candidates} onChangeText={setCandidates} error={errors.candidates} inputMode="numeric" />
      {start.error && !Object.keys(errors).length ? <Notice message={start.error.message} /> : null}
      {mayRun ? <Button label={running ? 'Dialling in…' : 'Start the dial-in'} onPress={onStart} busy={start.isPending} disabled={running} /> : <Notice tone="info" message="Owners and designers start dial-ins." />}
    </Card>
  );

  const progress = job.data ? (
    <Card>
      <SectionHeading>Progress</SectionHeading>
      <ProgressBar progress={job.data.progress} label={job.data.status === 'queued' ? 'Waiting for a free worker' : `${result?.candidatesTried ?? 0} candidates tried`} />
      {running ? <Button tone="quiet" label="Cancel" onPress={() => jobId && cancelJob(jobId).then(() => job.refetch())} /> : null}
      {job.data.status === 'failed' ? <Notice message={job.data.error ?? 'The dial-in failed.'} /> : null}
      {result?.history.length ? (
        <LinePlot
          title="Best so far"
          xLabel="candidate"
          yLabel="footing score"
          lines={[
            { label: 'candidate', color: colors.rule, xs: result.history.map((p) => p.candidate), ys: result.history.map((p) => p.score) },
            { label: 'best so far', color: colors.moss, xs: result.history.map((p) => p.candidate), ys: result.history.map((p) => p.best) },
          ]}
        />
      ) : null}
      {result?.before && result.after ? (
        <>
          <BeforeAfter result={result} />
          {result.acceptedLegSetupId || accept.data ? (
            <Notice tone="info" message={`Saved as leg setup version ${accept.data?.legSetup.version ?? ''}.`} />
          ) : mayRun ? (
            <Button label="Accept: save as a new leg setup version" onPress={() => jobId && accept.mutate({ jobId })} busy={accept.isPending} />
          ) : null}
          {accept.error ? <Notice message={accept.error.message} /> : null}
        </>
      ) : null}
    </Card>
  ) : null;

  return (
    <Screen title={`${characterName}: dial-in`} lede="The tuner searches the chosen settings within their bounds (Nelder–Mead) to raise the footing score over a suite.">
      <View style={[styles.split, wide && styles.splitWide]}>
        <View style={[styles.col, wide && styles.half]}>{setup}</View>
        <View style={[styles.col, wide && styles.half]}>{progress ?? <Text style={styles.note}>Progress, the best-so-far plot and the before/after figures appear here.</Text>}</View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  split: { gap: space.lg },
  splitWide: { flexDirection: 'row', alignItems: 'flex-start' },
  col: { gap: space.lg },
  half: { flex: 1, minWidth: 0 },
  param: { gap: space.xs },
  pair: { flexDirection: 'row', gap: space.md },
  cell: { flex: 1 },
  note: { ...type.small, color: colors.graphite, fontFamily: fonts.body },
});
