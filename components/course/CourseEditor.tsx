import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Platform, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { decodeCourse, encodeCourse, type CourseEncoding } from '../../engine/course/encoding';
import { heightRange } from '../../engine/course/heightfield';
import { courseUpdateSchema, COURSE_VERSION_CONFLICT, type CourseDetail, type CourseUpdate } from '../../schemas/courses';
import { fieldMessages } from '../../schemas/errors';
import { ApiError } from '../../hooks/api';
import { useIsWide } from '../../hooks/useLayout';
import { colors, space, type } from '../../constants/theme';
import { Screen } from '../layout/Screen';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { BrushBar, type BrushSettings } from './BrushBar';
import { ChoiceRow } from './ChoiceRow';
import { ConflictPanel } from './ConflictPanel';
import { CourseDetails } from './CourseDetails';
import { HeightMap } from './HeightMap';
import type { StrokeEvent } from './heightMapProps';
import { SculptHistory } from './history';
import { SculptStroke } from './stroke';
import { SideProfile } from './SideProfile';
import { courseFrame } from './frame';
import { rampRange } from './ramp';
import { RampLegend } from './RampLegend';
import { courseFigures } from './figures';
import type { WalkPath } from '../../engine/course/walk-path';
import { WalkPathEditor, pathWithPointAdded, straightPath } from './WalkPathEditor';
import { WalkPathSpeedField } from './WalkPathSpeedField';
import { keepUnsavedCourse, unsavedCourse, type UnsavedCourse } from './unsaved-course';

export interface CourseEditorProps {
  detail: CourseDetail;
  mayEdit: boolean;
  onSave(update: CourseUpdate): Promise<CourseDetail>;
  /** Fetches the course as saved now. */
  onReload(): Promise<CourseDetail>;
  onSaveCopy(name: string, encoding: CourseEncoding): Promise<void>;
  onDelete(): Promise<void>;
}

const PROFILE_DEPTH_PHONE = 104;
const PROFILE_DEPTH_WIDE = 170;
const SIDE_PANEL = 340;

/** The course editor: sculpt the map by finger or mouse, watch the profile, undo and redo, save with a version check. */
export function CourseEditor({ detail, mayEdit, onSave, onReload, onSaveCopy, onDelete }: CourseEditorProps) {
  const wide = useIsWide();
  const window = useWindowDimensions();
  // Edits left unsaved here earlier (another tab, Back) come back with their undo history.
  const [restored] = useState(() => unsavedCourse(detail.course.id, detail.course.version));
  const [hf, setHf] = useState(() => restored?.hf ?? decodeCourse(detail.encoding));
  const history = useRef(restored?.history ?? new SculptHistory()).current;
  const stroke = useRef<SculptStroke | null>(null);
  const [revision, setRevision] = useState(0);
  const frameRequest = useRef<number | null>(null);
  const [range, setRange] = useState(() => rangeOf(hf));
  const [brush, setBrush] = useState<BrushSettings>({ kind: 'raise', radius: 0.2, strength: 0.5 });
  // Paint mode: off on a phone so a swipe over the map scrolls; on at a desk, where the mouse paints.
  const [paint, setPaint] = useState(wide);
  // Path mode: a drag on the map moves the walk path's points instead of sculpting or scrolling.
  const [pathMode, setPathMode] = useState(false);
  const [walkPath, setWalkPath] = useState<WalkPath | undefined>(() => (restored ? restored.walkPath : hf.walkPath));
  const [savedPath, setSavedPath] = useState(() => restored?.savedPath ?? JSON.stringify(hf.walkPath ?? null));
  const [baseVersion, setBaseVersion] = useState(detail.course.version);
  const [savedPosition, setSavedPosition] = useState(restored?.savedPosition ?? 0);
  const [savedName, setSavedName] = useState(restored?.savedName ?? detail.course.name);
  const [name, setName] = useState(restored?.name ?? detail.course.name);
  const [status, setStatus] = useState<string | null>(restored ? 'Unsaved changes from before you left, still here' : null);
  const [problem, setProblem] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [conflict, setConflict] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [areaWidth, setAreaWidth] = useState(0);
  const viewport = useRef<ScrollView>(null);
  const atStart = useRef(false);

  const pathDirty = JSON.stringify(walkPath ?? null) !== savedPath;
  const dirty = history.position !== savedPosition || name.trim() !== savedName || pathDirty;
  const withPath = () => encodeCourse({ ...hf, walkPath });

  // Leaving keeps what is unsaved (read at unmount, so through a ref); closing or reloading the page asks first.
  const edits = useRef<UnsavedCourse | undefined>(undefined);
  edits.current = dirty && mayEdit ? { baseVersion, hf, history, savedPosition, savedName, name, walkPath, savedPath } : undefined;
  const deleted = useRef(false);
  useEffect(() => () => keepUnsavedCourse(detail.course.id, deleted.current ? undefined : edits.current), [detail.course.id]);
  useEffect(() => {
    if (!dirty || !mayEdit || Platform.OS !== 'web' || typeof globalThis.addEventListener !== 'function') return;
    const ask = (e: BeforeUnloadEvent) => e.preventDefault();
    globalThis.addEventListener('beforeunload', ask);
    return () => globalThis.removeEventListener('beforeunload', ask);
  }, [dirty, mayEdit]);

  const redraw = useCallback((now = false) => {
    if (now || typeof requestAnimationFrame === 'undefined') {
      setRevision((r) => r + 1);
      return;
    }
    if (frameRequest.current !== null) return;
    frameRequest.current = requestAnimationFrame(() => {
      frameRequest.current = null;
      setRevision((r) => r + 1);
    });
  }, []);

  function settle() {
    setRange(rangeOf(hf));
    setStatus(null);
    redraw(true);
  }

  function onStroke(e: StrokeEvent) {
    const p = { x: e.x, z: e.z };
    if (e.phase === 'start') {
      stroke.current = new SculptStroke(hf, { ...brush, falloff: 'smooth' }, p);
      redraw();
    } else if (e.phase === 'move') {
      if (stroke.current?.moveTo(p)) redraw();
    } else if (stroke.current) {
      stroke.current.moveTo(p);
      const change = stroke.current.finish();
      stroke.current = null;
      if (change) history.push(change);
      settle();
    }
  }

  async function save() {
    const update = { baseVersion, encoding: withPath(), ...(name.trim() !== savedName ? { name } : {}) };
    const checked = courseUpdateSchema.safeParse(update);
    if (!checked.success) {
      setFieldErrors(fieldMessages(checked.error.issues));
      return;
    }
    const position = history.position;
    setSaving(true);
    setProblem(null);
    setFieldErrors({});
    try {
      const saved = await onSave(checked.data);
      setBaseVersion(saved.course.version);
      setSavedPosition(position);
      setSavedName(saved.course.name);
      setSavedPath(JSON.stringify(update.encoding.walkPath ?? null));
      setStatus(`Saved as version ${saved.course.version}.`);
    } catch (err) {
      if (err instanceof ApiError && err.code === COURSE_VERSION_CONFLICT) setConflict(err.message);
      else if (err instanceof ApiError && Object.keys(err.fields).length) setFieldErrors(err.fields);
      else setProblem(err instanceof Error ? err.message : 'The course could not be saved. Try again.');
    } finally {
      setSaving(false);
    }
  }

  async function reload() {
    const fresh = await onReload();
    const next = decodeCourse(fresh.encoding);
    history.clear();
    stroke.current = null;
    setHf(next);
    setRange(rangeOf(next));
    setBaseVersion(fresh.course.version);
    setSavedPosition(0);
    setSavedName(fresh.course.name);
    setName(fresh.course.name);
    setWalkPath(next.walkPath);
    setSavedPath(JSON.stringify(next.walkPath ?? null));
    setConflict(null);
    setStatus(`Reloaded version ${fresh.course.version}.`);
    redraw(true);
  }

  const profileDepth = wide ? PROFILE_DEPTH_WIDE : PROFILE_DEPTH_PHONE;
  const frame = useMemo(() => {
    if (!areaWidth) return null;
    return wide
      ? courseFrame(hf, 'right', areaWidth, Math.min(340, window.height * 0.4))
      : courseFrame(hf, 'up', areaWidth - profileDepth - space.md - 4, 8000);
  }, [hf, wide, areaWidth, window.height, profileDepth]);

  const figures = courseFigures({ ...detail.course, version: baseVersion, minHeight: range.min, maxHeight: range.max });
  const readOnlyNote = mayEdit ? null : <Notice tone="info" message="Your role can look at courses but not change them. An owner or designer sculpts them." />;

  const toolbar = mayEdit ? (
    <View style={styles.toolbar}>
      <Button label="Undo" tone="quiet" disabled={!history.canUndo || !!stroke.current} onPress={() => history.undo(hf) && settle()} />
      <Button label="Redo" tone="quiet" disabled={!history.canRedo || !!stroke.current} onPress={() => history.redo(hf) && settle()} />
      <Button label="Save" busy={saving} disabled={!dirty || !!conflict} onPress={save} />
      <Text style={styles.status} role="status">
        {status ?? (dirty ? 'Unsaved changes' : `Version ${baseVersion}, nothing to save${history.canUndo ? '' : ' or undo'}`)}
      </Text>
    </View>
  ) : null;

  const messages = (
    <>
      {conflict ? (
        <ConflictPanel
          message={conflict}
          suggestedName={`${name.trim() || detail.course.name} (copy)`.slice(0, 80)}
          onReload={reload}
          onSaveCopy={(copyName) => onSaveCopy(copyName, withPath())}
        />
      ) : null}
      {problem ? <Notice message={problem} /> : null}
      {fieldErrors['encoding.heights'] || fieldErrors.encoding ? <Notice message={fieldErrors['encoding.heights'] ?? fieldErrors.encoding} /> : null}
      {Object.entries(fieldErrors).filter(([k]) => k.startsWith('encoding.walkPath') && k !== 'encoding.walkPath.speed').slice(0, 1).map(([k, m]) => (
        <Notice key={k} message={`Walk path: ${m}`} />
      ))}
    </>
  );

  const map = frame ? (
    <View style={{ width: frame.width, height: frame.height }}>
    <HeightMap
      hf={hf}
      frame={frame}
      revision={revision}
      lo={range.lo}
      hi={range.hi}
      brushRadius={mayEdit && paint && !pathMode ? brush.radius : undefined}
      onStroke={mayEdit && paint && !pathMode ? onStroke : undefined}
      label={`Height map of ${detail.course.name}${mayEdit && paint && !pathMode ? '; drag to sculpt' : ''}`}
    />
    <WalkPathEditor
      hf={hf}
      frame={frame}
      path={walkPath}
      editing={mayEdit && pathMode}
      onChange={(i, p) => {
        setWalkPath((w) => (w ? { ...w, points: w.points.map((q, k) => (k === i ? p : q)) } : w));
        setStatus(null);
      }}
      onDone={() => setFieldErrors(({ ...rest }) => Object.fromEntries(Object.entries(rest).filter(([k]) => !k.startsWith('encoding.walkPath'))))}
    />
    </View>
  ) : null;
  const paintChoices = [
    { value: 'scroll', label: 'Scroll' },
    { value: 'paint', label: 'Paint' },
    { value: 'path', label: 'Walk path' },
  ] as const;
  const paintValue = pathMode ? 'path' : paint ? 'paint' : 'scroll';
  const choose = (v: (typeof paintChoices)[number]['value']) => {
    setPathMode(v === 'path');
    if (v !== 'path') setPaint(v === 'paint');
  };
  const paintSwitch = mayEdit ? <ChoiceChips label="A drag on the map" choices={paintChoices} value={paintValue} onChange={choose} /> : null;
  const pathTools =
    mayEdit && pathMode ? (
      <View style={styles.pathTools} testID="walk-path-tools">
        <Text style={styles.hint}>
          {walkPath
            ? `Trials walk this curve through ${walkPath.points.length} points, starting at point 1. Drag a point to move it.`
            : 'Trials walk straight up the middle of this course. Set a walk path to lead them along a curve of your own.'}
        </Text>
        <View style={styles.toolbar}>
          {walkPath ? (
            <>
              <Button label="Add a point" tone="quiet" disabled={walkPath.points.length >= 32} onPress={() => setWalkPath(pathWithPointAdded(hf, walkPath))} />
              <Button label="Remove the last point" tone="quiet" disabled={walkPath.points.length <= 2} onPress={() => setWalkPath({ ...walkPath, points: walkPath.points.slice(0, -1) })} />
              <Button label="Walk straight ahead" tone="quiet" onPress={() => setWalkPath(undefined)} />
            </>
          ) : (
            <Button label="Set a walk path" tone="quiet" onPress={() => setWalkPath(straightPath(hf))} />
          )}
        </View>
        {walkPath ? (
          <ChoiceChips
            label="At the last point"
            choices={[
              { value: 'end', label: 'The walk ends' },
              { value: 'loop', label: 'It loops to point 1' },
            ]}
            value={walkPath.closed ? 'loop' : 'end'}
            onChange={(v) => setWalkPath({ ...walkPath, closed: v === 'loop' })}
            error={fieldErrors['encoding.walkPath.points'] ?? fieldErrors['encoding.walkPath']}
          />
        ) : null}
        {walkPath ? (
          <WalkPathSpeedField
            speed={walkPath.speed}
            onChange={(speed) => {
              setWalkPath((w) => (w ? { ...w, speed } : w));
              setFieldErrors(({ 'encoding.walkPath.speed': _gone, ...rest }) => rest);
              setStatus(null);
            }}
            error={fieldErrors['encoding.walkPath.speed']}
          />
        ) : null}
      </View>
    ) : null;
  const profile = frame ? <SideProfile hf={hf} frame={frame} revision={revision} depth={profileDepth} /> : null;
  const details = (
    <CourseDetails
      detail={detail}
      mayEdit={mayEdit}
      name={name}
      nameError={fieldErrors.name}
      onName={(v) => {
        setName(v);
        setFieldErrors(({ name: _gone, ...rest }) => rest);
      }}
      onDelete={async () => {
        await onDelete();
        // A deleted course keeps nothing (its id could come round again for a new one).
        deleted.current = true;
        keepUnsavedCourse(detail.course.id, undefined);
      }}
    />
  );

  return (
    <Screen title={savedName} lede={figures}>
      {readOnlyNote}
      {wide ? (
        <View style={styles.wideRow}>
          <View style={styles.wideMain} onLayout={(e) => setAreaWidth(Math.floor(e.nativeEvent.layout.width))}>
            {messages}
            {map}
            {profile}
            <RampLegend lo={range.lo} hi={range.hi} />
          </View>
          <View style={styles.widePanel}>
            {toolbar}
            {paintSwitch}
            {pathTools}
            {mayEdit && !pathMode ? <BrushBar value={brush} onChange={setBrush} disabled={!paint} /> : null}
            {mayEdit && !paint && !pathMode ? <Text style={styles.hint}>The brush is off while a drag on the map scrolls; choose Paint to sculpt.</Text> : null}
            {details}
          </View>
        </View>
      ) : (
        <>
          {toolbar}
          {messages}
          {mayEdit ? (
            // The brush stays in reach: this strip sticks to the top of the page while the map scrolls under it.
            <View style={styles.tools} testID="sculpt-tools">
              <ChoiceRow label="Drag to" choices={paintChoices} value={paintValue} onChange={choose} />
              {paint && !pathMode ? <BrushBar value={brush} onChange={setBrush} compact /> : null}
            </View>
          ) : null}
          {pathTools}
          {mayEdit && pathMode ? null : mayEdit ? (
            <Text style={styles.hint}>
              {paint
                ? 'Painting: a drag on the map sculpts; drag the profile beside it to move along. The walk starts at the bottom.'
                : 'Scrolling: swipes move the page and the map. Choose Paint to sculpt. The walk starts at the bottom.'}
            </Text>
          ) : (
            <Text style={styles.hint}>The walk starts at the bottom of the map.</Text>
          )}
          <View onLayout={(e) => setAreaWidth(Math.floor(e.nativeEvent.layout.width))}>
            {frame ? (
              <ScrollView
                ref={viewport}
                testID="sculpt-viewport"
                // The walk starts at the bottom of the map: open the window there.
                onContentSizeChange={() => {
                  if (atStart.current) return;
                  atStart.current = true;
                  viewport.current?.scrollToEnd({ animated: false });
                }}
                style={[styles.viewport, { height: Math.min(frame.height + 24, Math.max(260, window.height - 420)) }]} contentContainerStyle={styles.phoneArea}>
                {map}
                {profile}
              </ScrollView>
            ) : null}
          </View>
          <RampLegend lo={range.lo} hi={range.hi} />
          {details}
        </>
      )}
    </Screen>
  );
}

function rangeOf(hf: ReturnType<typeof decodeCourse>) {
  const { min, max } = heightRange(hf);
  return { min, max, ...rampRange(min, max) };
}

const styles = StyleSheet.create({
  toolbar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  status: { ...type.small, color: colors.graphite, flexBasis: '100%' },
  hint: { ...type.small, color: colors.graphite },
  pathTools: { gap: space.sm },
  // position: sticky is a web value react-native-web passes through; the page's scroll view is its container.
  tools: { position: 'sticky' as 'relative', top: 0, zIndex: 2, gap: 6, paddingVertical: space.sm, backgroundColor: colors.paper, borderBottomWidth: 1, borderColor: colors.rule },
  phoneArea: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  viewport: { borderRadius: 8, borderWidth: 1, borderColor: colors.rule, backgroundColor: colors.card },
  wideRow: { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' },
  wideMain: { flex: 1, gap: space.md, minWidth: 0 },
  widePanel: { width: SIDE_PANEL, gap: space.lg },
});
