import { useMemo, useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { Link } from 'expo-router';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { LegSetupList } from '../../schemas/leg-setups';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { Screen } from '../layout/Screen';
import { SplitColumns } from '../layout/SplitColumns';
import { PreviewOrDrive } from '../drive/PreviewOrDrive';
import { RunTrialPanel } from '../trial/RunTrialPanel';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';
import { StarterCourses } from '../course/StarterCourses';
import type { Mutation } from '../../hooks/mutation';
import type { PreviewCourse } from '../../hooks/usePreviewCourse';
import type { TrialRunner } from '../../hooks/useTrialRunner';
import type { LegSetupCreate, LegSetupVersion } from '../../schemas/leg-setups';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { LegSetupForm } from './LegSetupForm';
import type { LimitLeg } from './LegLimitsEditor';
import { BODY_FIELDS, checkDraft, draftOf, FOOTHOLD_FIELDS, GAIT_FIELDS, SOLVER_FIELDS, type Draft } from './setup-draft';
import { VersionList } from './VersionList';

/** Why "Run trial" waits while the edited form has settings that need attention. */
const FIX_FIRST = 'The trial runs the settings in the form: first fix the ones marked there.';

const NOT_A_NUMBER = 'Enter a number.';
const NUMBER_LABELS = new Map([...SOLVER_FIELDS, ...GAIT_FIELDS, ...BODY_FIELDS, ...FOOTHOLD_FIELDS].map((f) => [f.path, f.label]));

/** A box that holds no number says so in words, not as the schema's "expected number, received NaN". */
function readable(checked: ReturnType<typeof checkDraft>): ReturnType<typeof checkDraft> {
  if (!checked.errors) return checked;
  const errors = Object.fromEntries(Object.entries(checked.errors).map(([k, m]) => [k, /expected number, received (NaN|undefined)/.test(m) ? NOT_A_NUMBER : m]));
  return { setup: null, errors };
}

/** The first problem, for the preview far from its field: a bare "Enter a number." says which box. */
function firstProblem(errors: Record<string, string>): string {
  const [path, message] = Object.entries(errors)[0];
  const label = NUMBER_LABELS.get(path);
  return message === NOT_A_NUMBER && label ? `${label} needs a number.` : message;
}

/** The leg setup of one character: the form, the live preview beside it, saved versions, and running a trial. */
export function SetupPage({ characterId, characterName, list, mayEdit, mayRun, mayDialIn, mayEditCourses = false, addStarters, save, runner, previewCourse }: { characterId: number; characterName: string; list: LegSetupList; mayEdit: boolean; mayRun: boolean; mayDialIn: boolean; mayEditCourses?: boolean; addStarters: Mutation<void, StarterCoursesResponse>; save: Mutation<LegSetupCreate, { legSetup: LegSetupVersion }>; runner: TrialRunner; previewCourse: PreviewCourse }) {
  const wide = useIsWide();
  const start = list.versions[0]?.setup ?? list.defaults;
  const [draft, setDraft] = useState<Draft>(() => draftOf(start));
  const [note, setNote] = useState('');
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'info' | 'problem'; text: string } | null>(null);
  const checked = useMemo(() => readable(checkDraft(draft)), [draft]);
  const lastValid = useRef<LegSetup>(start);
  if (checked.setup) lastValid.current = checked.setup;
  const previewSetup = checked.setup ?? lastValid.current;
  const errors = { ...(checked.errors ?? {}), ...serverErrors };
  // Sent without a setup, a trial walks the newest version (else the defaults): the form as loaded. Unchanged, the
  // server's refusal names the fix with the rig's own figures; edited, it would walk something else, so it waits.
  const loaded = useMemo(() => draftOf(start), [start]);
  const edited = Object.keys({ ...draft, ...loaded }).some((k) => draft[k] !== loaded[k]);
  const legs: LimitLeg[] = list.rig.legs.map((l) => ({ name: l.name, joints: l.chain.joints.filter((j) => j.kind !== 'ball').map((j) => ({ name: j.name, slider: j.kind === 'slider' })) }));
  const { courses, suites } = runner;
  const noGround = courses.isSuccess && suites.isSuccess && courses.data.courses.length === 0 && suites.data.suites.length === 0;
  const preview = (compact: boolean) => <PreviewOrDrive rig={list.rig} setup={previewSetup} problem={checked.errors ? firstProblem(checked.errors) : null} ground={previewCourse} compact={compact} />;

  const change = (path: string, value: string) => {
    setDraft((d) => ({ ...d, [path]: value }));
    setServerErrors({});
    setMessage(null);
  };

  async function onSave() {
    if (!checked.setup) {
      setMessage({ tone: 'problem', text: 'Some settings need attention; see the messages beside them.' });
      return;
    }
    try {
      const saved = await save.mutateAsync({ setup: checked.setup, note });
      setNote('');
      setMessage({ tone: 'info', text: `Saved as version ${saved.legSetup.version}.` });
    } catch (err) {
      const fields = (err as { fields?: Record<string, string> }).fields ?? {};
      setServerErrors(Object.fromEntries(Object.entries(fields).map(([k, v]) => [k.replace(/^setup\./, ''), v])));
      setMessage({ tone: 'problem', text: (err as Error).message });
    }
  }

  const form = (
    <Card>
      <LegSetupForm draft={draft} errors={errors} onChange={change} legs={legs} disabled={!mayEdit} />
      {mayEdit ? (
        <View style={styles.actions}>
          <TextField label="Note for this version (optional)" value={note} onChangeText={setNote} error={serverErrors.note} />
          {message ? <Notice tone={message.tone} message={message.text} /> : null}
          <View style={styles.buttons}>
            <Button label="Save as a new version" onPress={onSave} busy={save.isPending} />
            <Button tone="quiet" label="Reset to defaults" onPress={() => { setDraft(draftOf(list.defaults)); setServerErrors({}); setMessage({ tone: 'info', text: 'The engine defaults are in the form; save to keep them.' }); }} />
          </View>
        </View>
      ) : (
        <Notice tone="info" message="Your role can read leg setups; owners and designers change them." />
      )}
    </Card>
  );
  const trialCard = mayRun ? (
    <Card>
      <SectionHeading>Trial of record</SectionHeading>
      {noGround ? (
        // "Run trial" would sit there disabled; say why and offer the way out instead.
        <StarterCourses mayEdit={mayEditCourses} add={addStarters} reason="“Run trial” needs ground to walk over, and this studio has no course or suite yet." />
      ) : (
        <>
          <Text style={styles.note}>Runs the settings in the form (saved or not) on the server.</Text>
          <RunTrialPanel runner={runner} characterId={characterId} legSetup={checked.setup ?? undefined} blockedBy={checked.errors && edited ? FIX_FIRST : null} onFieldErrors={(f) => setServerErrors(Object.fromEntries(Object.entries(f).map(([k, v]) => [k.replace(/^(legSetup|setup)\./, ''), v])))} />
        </>
      )}
    </Card>
  ) : null;
  const side = (
    <View style={styles.col}>
      {wide ? (
        <Card>
          <SectionHeading>Live preview</SectionHeading>
          {preview(false)}
        </Card>
      ) : null}
      {trialCard}
      <Card>
        <SectionHeading>Versions</SectionHeading>
        <VersionList versions={list.versions} onPick={(v) => { setDraft(draftOf(v.setup)); setMessage({ tone: 'info', text: `Version ${v.version} is in the form.` }); }} />
        {mayDialIn ? (
          <Link href={`/characters/dial-in/${characterId}`} style={styles.link}>
            Dial in these settings automatically →
          </Link>
        ) : null}
      </Card>
    </View>
  );
  return (
    <Screen title={`${characterName}: leg setup`} lede="Every setting of the legs: the solver, the gait and the body. Changes show in the preview at once.">
      <SplitColumns
        weights={[3, 2]}
        main={form}
        side={side}
        // Phone: a small preview sticks to the top of the page while the form scrolls under it.
        narrow={
          <>
            <View style={styles.sticky} testID="sticky-preview">
              {preview(true)}
            </View>
            {form}
            {side}
          </>
        }
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  col: { gap: space.lg },
  actions: { gap: space.md },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  note: { ...type.small, color: colors.graphite },
  link: { ...type.label, color: colors.ember, paddingVertical: space.md },
  // position: sticky is a web value react-native-web passes through; the page's scroll view is its container.
  sticky: { position: 'sticky' as 'relative', top: 0, zIndex: 2, backgroundColor: colors.paper, paddingBottom: space.sm, borderBottomWidth: 1, borderColor: colors.rule },
});
