import { useCallback, useMemo, useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { decodeCourse } from '../../engine/course/encoding';
import { decodeSeries } from '../../engine/gait/series-encoding';
import type { TrialDetail } from '../../schemas/trials';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import type { QueryState } from '../../hooks/mutation';
import type { TrialRunner } from '../../hooks/useTrialRunner';
import { useWalkReplay } from '../viewer/useWalkReplay';
import type { StageFocus } from '../viewer/WalkStage';
import { Screen } from '../layout/Screen';
import { SplitColumns } from '../layout/SplitColumns';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { MetricCards } from './MetricCards';
import { RunTrialPanel } from './RunTrialPanel';
import { StumbleTimeline } from './StumbleTimeline';
import { TrialPlayback } from './TrialPlayback';
import { TrialPlots } from './TrialPlots';

/** A stored trial: playback, stumble timeline, metric cards, plots, and running it again. Wide screens put playback and figures side by side. */
export function TrialPage({ detail, characterName, mayRun, mesh, runner }: { detail: TrialDetail; characterName: string; mayRun: boolean; /** The character's glTF file, for the playback's mesh. */ mesh: QueryState<ArrayBuffer>; runner: TrialRunner }) {
  const wide = useIsWide();
  const series = useMemo(() => decodeSeries(detail.series), [detail.series]);
  const course = useMemo(() => (detail.course ? decodeCourse(detail.course) : null), [detail.course]);
  const [time, setTimeRaw] = useState(0);
  const { trial } = detail;
  const duration = Math.max(0, (series.length - 1) / series.rate);
  // Whatever asks to move the playhead, the clock only ever holds a time inside the walk.
  const setTime = useCallback((t: number) => {
    if (Number.isFinite(t)) setTimeRaw(Math.min(duration, Math.max(0, t)));
  }, [duration]);
  const setupLabel = trial.legSetupVersion ? `leg setup v${trial.legSetupVersion}` : 'an unsaved leg setup';

  const replayState = useWalkReplay(detail.rig, detail.setup, course, series);
  const [focus, setFocus] = useState<StageFocus | null>(null);
  const focusSeq = useRef(0);
  const replay = replayState.state === 'ready' ? replayState.replay : null;
  const replayNote = replayState.state === 'failed' ? replayState.reason : replayState.state === 'running' ? 'Replaying the walk to pose the character…' : null;
  const meshNote = mesh.isError ? `${mesh.error.message} The walk is drawn as a skeleton.` : null;
  const caption = useMemo(
    () => ({ lines: [characterName, trial.courseName, setupLabel.replace(/^l/, 'L'), `Footing score ${trial.footingScore.toFixed(1)} on this course`] }),
    [characterName, trial.courseName, setupLabel, trial.footingScore],
  );

  const playback = course ? (
    <TrialPlayback
      series={series}
      course={course}
      rig={detail.rig}
      time={time}
      onTime={setTime}
      height={wide ? 420 : 300}
      replay={replay}
      replayNote={replayNote}
      mesh={mesh.data ?? null}
      meshNote={meshNote}
      events={trial.metrics.events}
      focus={focus}
      wide={wide}
      caption={caption}
      clipName={`${characterName} on ${trial.courseName}`}
    />
  ) : (
    <Notice tone="info" message="The course of this trial was deleted; its figures and plots remain." />
  );
  return (
    <Screen title={`${characterName} on ${trial.courseName}`} lede={`Trial ${trial.id}: ${setupLabel}, ${trial.metrics.simSeconds.toFixed(1)} s simulated, ${trial.metrics.steps} steps.`}>
      {detail.courseChanged ? <Notice tone="info" message={`The course was edited after this trial (it ran version ${trial.courseVersion}); the playback shows the course as it is now.`} /> : null}
      <SplitColumns
        weights={[3, 2]}
        main={
          <>
            {playback}
            <Card>
              <SectionHeading>Stumbles</SectionHeading>
              <StumbleTimeline
                events={trial.metrics.events}
                duration={duration}
                time={time}
                onSeek={setTime}
                onStumble={(e) => {
                  setTime(e.time);
                  setFocus({ walker: 'trial', leg: e.leg, time: e.time, seq: ++focusSeq.current });
                }}
                legNames={trial.legNames}
              />
            </Card>
          </>
        }
        side={<MetricCards metrics={trial.metrics} />}
      />
      <Card>
        <SectionHeading>Plots</SectionHeading>
        <TrialPlots series={series} legNames={trial.legNames} time={time} rig={detail.rig} setup={detail.setup} course={course} duration={trial.metrics.simSeconds} />
      </Card>
      {mayRun ? (
        <Card>
          <SectionHeading>Run again</SectionHeading>
          <Text style={styles.note}>The same character and setup as a new trial of record.</Text>
          <RunTrialPanel runner={runner} characterId={trial.characterId} legSetupId={trial.legSetupId ?? undefined} legSetup={trial.legSetupId ? undefined : detail.setup} initialCourseId={trial.courseId} />
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  note: { ...type.small, color: colors.graphite },
});
