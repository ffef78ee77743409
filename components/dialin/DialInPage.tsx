import { useEffect, useRef, useState } from 'react';
import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { dialInRequestSchema, TUNABLE_SETTINGS, type DialInRequest, type DialInResult } from '../../schemas/dial-ins';
import { fieldMessages } from '../../schemas/errors';
import { colors, fonts, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import type { Mutation, QueryState } from '../../hooks/mutation';
import type { SuiteList } from '../../schemas/courses';
import type { LegSetupList, LegSetupVersion } from '../../schemas/leg-setups';
import type { Job, JobAccepted } from '../../schemas/jobs';
import type { TrialSummary } from '../../schemas/trials';
import type { DialInAllowance } from '../../schemas/dial-in-allowance';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { LinePlot } from '../charts/LinePlot';
import { StarterCourses } from '../course/StarterCourses';
import { Screen } from '../layout/Screen';
import { SplitColumns } from '../layout/SplitColumns';
import { ProgressBar } from '../trial/ProgressBar';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';
import { BeforeAfter } from './BeforeAfter';
import { DialInCost } from './DialInCost';
import { NoGainPanel } from './NoGainPanel';
import { displayUnit, foundNothing, showValue, valueAt } from './outcome';

type Bounds = Record<string, { on: boolean; min: string; max: string }>;

const shown = (key: string, v: number) => String(parseFloat((v * displayUnit(key).scale).toPrecision(3)));

const initialBounds = (): Bounds =>
  Object.fromEntries(TUNABLE_SETTINGS.map((t, i) => [t.key, { on: i === 4 || t.key === 'body.heightOffset', min: shown(t.key, t.suggested[0]), max: shown(t.key, t.suggested[1]) }]));

/** The schema's bounds are in the setting's own unit; a field typed in degrees says them in degrees. */
function inDisplayUnit(key: string, message: string): string {
  const { unit, scale } = displayUnit(key);
  if (scale === 1) return message;
  return message.replace(/(-?\d+(?:\.\d+)?(?:e-?\d+)?)(\.?)$/, (_, n: string, dot: string) => `${parseFloat((Number(n) * scale).toPrecision(3))}${unit}${dot}`);
}

/** Brings a block into view on the web (react-native-web Views are DOM elements); a no-op elsewhere. */
function scrollIntoView(ref: React.RefObject<View | null>) {
  const el = ref.current as unknown as { scrollIntoView?: (o: object) => void } | null;
  el?.scrollIntoView?.({ block: 'start' });
}

/** Dial-in: what to tune and in which bounds (each with its value now), the suite, the budget and its cost; progress in view once started; before/after, and accept only when it found something. */
export function DialInPage({
  characterId,
  characterName,
  mayRun,
  mayEditCourses,
  suites,
  setups,
  allowance,
  start,
  accept,
  jobId,
  onJob,
  job,
  onCancel,
  trials,
  addStarters,
}: {
  characterId: number;
  characterName: string;
  mayRun: boolean;
  mayEditCourses: boolean;
  suites: QueryState<SuiteList>;
  setups: QueryState<LegSetupList>;
  allowance: QueryState<DialInAllowance>;
  start: Mutation<DialInRequest, JobAccepted>;
  accept: Mutation<{ jobId: number; note?: string }, { legSetup: LegSetupVersion }>;
  /** The dial-in started from this page, and its job as it runs. */
  jobId: number | null;
  onJob: (id: number) => void;
  job: QueryState<Job>;
  onCancel: (jobId: number) => Promise<unknown>;
  /** The character's trials (for why a dial-in found nothing). */
  trials: readonly TrialSummary[] | undefined;
  addStarters: Mutation<void, StarterCoursesResponse>;
}) {
  const wide = useIsWide();
  const [suiteId, setSuiteId] = useState<string | undefined>();
  const [bounds, setBounds] = useState<Bounds>(initialBounds);
  const [candidates, setCandidates] = useState('200');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [startSetup, setStartSetup] = useState<unknown>(undefined);
  const progressRef = useRef<View>(null);
  useEffect(() => {
    if (!suiteId && suites.data?.suites.length) setSuiteId(String(suites.data.suites[0].id));
  }, [suiteId, suites.data]);
  const status = job.data?.status;
  const hasProgress = jobId !== null && !!job.data;
  // Once the progress card is there (first poll of the job), bring it into view.
  useEffect(() => {
    if (hasProgress) scrollIntoView(progressRef);
  }, [hasProgress, jobId]);
  useEffect(() => {
    if (status === 'done') allowance.refetch();
  }, [status]);
  const result = job.data?.result as DialInResult | undefined;
  const running = status === 'queued' || status === 'running';
  const picked = TUNABLE_SETTINGS.filter((t) => bounds[t.key].on);
  const newest = setups.data?.versions[0];
  const current = newest?.setup ?? setups.data?.defaults;
  const suite = suites.data?.suites.find((s) => String(s.id) === suiteId);
  const count = Number(candidates);
  const left = allowance.data ? allowance.data.limit - allowance.data.used : null;
  const overAllowance = left !== null && Number.isInteger(count) && count > left;
  const noSuite = suites.isSuccess && suites.data.suites.length === 0;

  async function onStart() {
    const body = {
      characterId,
      suiteId: Number(suiteId ?? 0),
      params: picked.map((t) => {
        const { scale } = displayUnit(t.key);
        return { key: t.key, min: Number(bounds[t.key].min) / scale, max: Number(bounds[t.key].max) / scale };
      }),
      candidates: count,
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
    if (accepted) {
      setStartSetup(current);
      onJob(accepted.job.id);
    }
  }

  const fieldError = (key: string, part: 'min' | 'max') => {
    const i = picked.findIndex((t) => t.key === key);
    const message = i >= 0 ? errors[`params.${i}.${part}`] : undefined;
    return message ? inDisplayUnit(key, message) : undefined;
  };

  // Why "Start" cannot be pressed, said where the button would be.
  const blocked = running ? null : noSuite ? 'no-suite' : overAllowance ? 'allowance' : null;

  const setup = (
    <Card>
      <SectionHeading>What to tune</SectionHeading>
      <Text style={styles.note}>
        Starts from {newest ? `leg setup v${newest.version}` : 'the engine’s defaults (no saved version yet)'}; “now” is its value.
      </Text>
      {TUNABLE_SETTINGS.map((t) => {
        const { unit } = displayUnit(t.key);
        const now = valueAt(current, t.key);
        return (
          <View key={t.key} style={styles.param}>
            <ChoiceChips
              label={`${unit ? `${t.label} (${unit})` : t.label}${now === null ? '' : ` · now ${showValue(t.key, now)}`}`}
              choices={[{ value: 'on', label: 'tune' }, { value: 'off', label: 'keep' }]}
              value={bounds[t.key].on ? 'on' : 'off'}
              onChange={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], on: v === 'on' } }))}
              disabled={running}
            />
            {bounds[t.key].on ? (
              <View style={styles.pair}>
                <View style={styles.cell}>
                  <TextField label="From" nativeID={`dial-${t.key}-min`} value={bounds[t.key].min} onChangeText={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], min: v } }))} error={fieldError(t.key, 'min')} inputMode="decimal" editable={!running} />
                </View>
                <View style={styles.cell}>
                  <TextField label="To" nativeID={`dial-${t.key}-max`} value={bounds[t.key].max} onChangeText={(v) => setBounds((b) => ({ ...b, [t.key]: { ...b[t.key], max: v } }))} error={fieldError(t.key, 'max')} inputMode="decimal" editable={!running} />
                </View>
              </View>
            ) : null}
          </View>
        );
      })}
      {errors.params ? <Notice message={errors.params} /> : null}
      {noSuite ? (
        <StarterCourses mayEdit={mayEditCourses} add={addStarters} reason="A dial-in runs over a suite, and this studio has none yet." />
      ) : (
        <ChoiceChips label="Suite" choices={(suites.data?.suites ?? []).map((s) => ({ value: String(s.id), label: s.name }))} value={suiteId} onChange={setSuiteId} error={errors.suiteId} disabled={running} />
      )}
      <TextField label="Budget (candidates; each is a trial per course)" value={candidates} onChangeText={setCandidates} error={errors.candidates} inputMode="numeric" editable={!running} />
      {mayRun ? <DialInCost candidates={count} courses={suite?.courses.length ?? null} allowance={allowance.data ?? null} /> : null}
      {start.error && !Object.keys(errors).some((k) => k === 'params' || k === 'suiteId' || k === 'candidates' || /^params\.\d+\.(min|max)$/.test(k)) ? <Notice message={start.error.message} /> : null}
      {mayRun ? (
        <>
          <Button label={running ? 'Dialling in…' : 'Start the dial-in'} onPress={onStart} busy={start.isPending} disabled={running || !!blocked} />
          {running ? <Text style={styles.why}>A dial-in is running; its progress is shown {wide ? 'beside this form' : 'at the top of the page'}.</Text> : null}
          {blocked === 'no-suite' ? <Text style={styles.why}>Start needs a suite to run over: add the starter courses above.</Text> : null}
          {blocked === 'allowance' ? <Text style={styles.why}>Start is off: {count} candidates is more than the {left} left this month. Lower the budget, or wait for next month.</Text> : null}
        </>
      ) : (
        <Notice tone="info" message="Owners and designers start dial-ins." />
      )}
    </Card>
  );

  const gainless = foundNothing(result);
  const accepted = result?.acceptedLegSetupId || accept.data;
  const progress = job.data ? (
    <Card>
      <SectionHeading>Progress</SectionHeading>
      <ProgressBar progress={job.data.progress} label={status === 'queued' ? 'Waiting for a free worker' : `${result?.candidatesTried ?? 0} of ${count} candidates tried`} />
      {result?.bestSoFar !== undefined && result?.bestSoFar !== null ? (
        <Text style={styles.note}>
          Best so far <Text style={styles.fig}>{result.bestSoFar.toFixed(1)}</Text>
        </Text>
      ) : null}
      {running ? <Button tone="quiet" label="Cancel" onPress={() => jobId && onCancel(jobId).then(() => job.refetch())} /> : null}
      {status === 'failed' ? <Notice message={job.data.error ?? 'The dial-in failed.'} /> : null}
      {status === 'cancelled' ? <Notice tone="info" message="The dial-in was cancelled; nothing was saved." /> : null}
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
          <BeforeAfter result={result} startSetup={startSetup} />
          {gainless ? (
            <NoGainPanel result={result} trials={trials} />
          ) : accepted ? (
            <View style={styles.onward} testID="dial-in-accepted">
              <Notice tone="info" message={`Saved as leg setup version ${accept.data?.legSetup.version ?? ''}. It is now the newest version, so trials and publishing start from it.`} />
              <Link href={`/characters/setup/${characterId}`} style={styles.link}>
                Run a trial with it →
              </Link>
              <Link href="/profiles" style={styles.link}>
                Publish it as a leg profile →
              </Link>
            </View>
          ) : mayRun ? (
            <Button label="Accept: save as a new leg setup version" onPress={() => jobId && accept.mutate({ jobId })} busy={accept.isPending} />
          ) : null}
          {accept.error ? <Notice message={accept.error.message} /> : null}
        </>
      ) : null}
    </Card>
  ) : null;

  const progressBlock = (
    <View ref={progressRef} style={styles.col} testID="dial-in-progress">
      {progress ?? <Text style={styles.note}>Progress, the best-so-far plot and the before/after figures appear here.</Text>}
    </View>
  );
  return (
    <Screen title={`${characterName}: dial-in`} lede="The tuner searches the chosen settings within their bounds (Nelder–Mead) to raise the footing score over a suite.">
      <SplitColumns
        main={setup}
        side={progressBlock}
        stickySide
        // Phone: once started, progress comes first so it is in view, not under the long form.
        narrow={
          <>
            {progress ? progressBlock : null}
            {setup}
            {progress ? null : progressBlock}
          </>
        }
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  col: { gap: space.lg },
  param: { gap: space.xs },
  pair: { flexDirection: 'row', gap: space.md },
  cell: { flex: 1 },
  note: { ...type.small, color: colors.graphite, fontFamily: fonts.body },
  why: { ...type.small, color: colors.graphite },
  fig: { fontFamily: fonts.monoMedium, color: colors.ink },
  onward: { gap: space.xs },
  link: { ...type.label, color: colors.ember, paddingVertical: space.md, minHeight: 44 },
});
