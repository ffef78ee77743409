import { useEffect, useMemo, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import * as THREE from 'three';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { StumbleKind } from '../../engine/metrics/stumble-thresholds';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import type { PreviewCourse } from '../../hooks/usePreviewCourse';
import { useIsWide } from '../../hooks/useLayout';
import { createDriveWalk, DRIVE_STUMBLE_KINDS as STUMBLE_KIND_NAMES, type DriveWalk } from './drive-walk';
import { ChipGroup, ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { StumbleGlyph } from '../trial/StumbleGlyph';
import { STUMBLE_LABELS, stumbleColor } from '../trial/stumble-glyphs';
import { WalkView } from '../trial/WalkView';
import type { WalkPose } from '../trial/walk-scene';
import { Thumbstick, type StickValue } from './Thumbstick';
import { keysToDrive, useDriveKeys } from './useDriveKeys';
import { behindCamera, createFollowYaw, stepFollowYaw, wrapAngle } from './follow-camera';

/** How long a stumble's flash stays up, ms. */
const FLASH_MS = 1200;
/** Longest frame time handed to the walker, s: a tab coming back from the background does not leap. */
const MAX_FRAME = 0.1;

type CameraMode = 'behind' | 'fixed';
const CAMERA_MODES = [
  { value: 'behind', label: 'Follows behind' },
  { value: 'fixed', label: 'Fixed angle' },
] as const;

/** Degrees in (−180, 180], one decimal: how the heading and the view's direction read on screen. */
const degrees = (rad: number) => Math.round((wrapAngle(rad) * 1800) / Math.PI) / 10;

interface Flash {
  kind: StumbleKind;
  seq: number;
}

/**
 * Drive: the character walks live over a course with the form's setup (saved or not), as far and as long as
 * the stick is pushed (phone) or W / ↑ held (wide screens). Stumbles flash the moment the detector counts them.
 */
export function DriveView({ rig, setup, ground, compact = false }: { rig: Rig; setup: LegSetup; ground: PreviewCourse; compact?: boolean }) {
  const wide = useIsWide();
  const { list, courseId, setCourseId, next: nextCourse, name: shownName, heightfield } = ground;
  const [error, setError] = useState<string | null>(null);
  const [restart, setRestart] = useState(0);
  const walker = useMemo<DriveWalk | null>(() => {
    if (!heightfield) return null;
    try {
      setError(null);
      return createDriveWalk(rig, setup, heightfield);
    } catch (err) {
      setError((err as Error).message);
      return null;
    }
    // A new walk for "Back to the start" as well.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [rig, setup, heightfield, restart]);

  const stick = useRef<StickValue>({ x: 0, y: 0 });
  const keys = useDriveKeys(true);
  const [flash, setFlash] = useState<Flash | null>(null);
  // The heading reads "—" until the walk has run its first frame.
  const [readout, setReadout] = useState({ x: 0, z: 0, walked: 0, heading: NaN, view: NaN, counts: new Int32Array(STUMBLE_KIND_NAMES.length), resting: true, problem: null as string | null });
  const [cameraMode, setCameraMode] = useState<CameraMode>('behind');

  // What the draw loop keeps between frames, made once per walk.
  const frame = useMemo(
    () =>
      walker
        ? {
            counts: new Int32Array(STUMBLE_KIND_NAMES.length),
            seen: new Int32Array(STUMBLE_KIND_NAMES.length),
            px: NaN,
            pz: NaN,
            walked: 0,
            last: -1,
            told: 0,
            seq: 0,
            dt: 0,
            follow: createFollowYaw(),
            eye: new Float64Array(3),
            look: new Float64Array(3),
            towards: new THREE.Vector3(),
            /** The drawn camera's direction flattened onto the ground, rad (as the heading). */
            view: 0,
          }
        : null,
    [walker],
  );
  const hipHeight = Math.max(rig.hipHeight, 0.2);

  const poseAt = (): WalkPose | null => {
    if (!walker || !frame) return null;
    const now = performance.now();
    const dt = frame.last < 0 ? 0 : Math.min(MAX_FRAME, (now - frame.last) / 1000);
    frame.last = now;
    frame.dt = dt;
    const fromKeys = keysToDrive(keys.current);
    const pose = walker.advance(dt, Math.max(fromKeys.forward, stick.current.y), fromKeys.turn - stick.current.x);
    const [x, , z] = pose.body;
    // Distance walked over the ground, however the walk turned.
    if (!Number.isNaN(frame.px)) frame.walked += Math.hypot(x - frame.px, z - frame.pz);
    frame.px = x;
    frame.pz = z;
    walker.counts(frame.counts);
    for (let k = 0; k < frame.counts.length; k++) {
      if (frame.counts[k] > frame.seen[k]) {
        frame.seen[k] = frame.counts[k];
        setFlash({ kind: STUMBLE_KIND_NAMES[k], seq: ++frame.seq });
      }
    }
    // The readout on screen: a few times a second is enough, and keeps React out of most frames.
    if (now - frame.told > 200) {
      frame.told = now;
      setReadout({ x, z, walked: frame.walked, heading: walker.heading, view: frame.view, counts: Int32Array.from(frame.counts), resting: walker.resting, problem: walker.problem });
    }
    return pose;
  };

  // After the scene's own camera: behind the heading when asked, and in either mode the view's direction noted.
  const aim = (camera: THREE.PerspectiveCamera, pose: WalkPose) => {
    if (!walker || !frame) return;
    // The spring runs in the fixed view too, so switching back does not swing round from an old heading.
    const yaw = stepFollowYaw(frame.follow, walker.heading, frame.dt);
    if (cameraMode === 'behind') {
      behindCamera(pose.body[0], pose.body[1], pose.body[2], hipHeight, yaw, frame.eye, frame.look);
      camera.position.set(frame.eye[0], frame.eye[1], frame.eye[2]);
      camera.lookAt(frame.look[0], frame.look[1], frame.look[2]);
    }
    camera.getWorldDirection(frame.towards);
    frame.view = Math.atan2(frame.towards.x, frame.towards.z);
  };

  useEffect(() => {
    if (!flash) return;
    const timer = setTimeout(() => setFlash((f) => (f?.seq === flash.seq ? null : f)), FLASH_MS);
    return () => clearTimeout(timer);
  }, [flash]);

  const viewHeight = compact ? 220 : 320;
  const cameraChips = <ChipGroup<CameraMode> label="Drive camera" choices={CAMERA_MODES} value={cameraMode} onChange={setCameraMode} compact={compact} />;
  const finite = Number.isFinite(readout.x) && Number.isFinite(readout.z);
  return (
    <View style={styles.wrap} testID="drive-view" {...({ dataSet: { heading: degrees(readout.heading), view: degrees(readout.view) } } as object)}>
      {compact ? (
        <View style={styles.compactHead}>
          <Text style={styles.compactTitle} numberOfLines={1}>
            Drive{shownName ? ` · ${shownName}` : ''}
          </Text>
          {list.length > 1 ? (
            <Pressable onPress={nextCourse} role="button" accessibilityLabel="Drive on the next course" style={styles.nextCourse}>
              <Text style={styles.nextCourseText}>Next course ›</Text>
            </Pressable>
          ) : null}
        </View>
      ) : (
        <ChoiceChips label="Drive on" choices={list.map((c) => ({ value: String(c.id), label: c.name }))} value={courseId} onChange={setCourseId} />
      )}
      {compact ? null : cameraChips}
      <View>
        {heightfield && walker ? (
          <WalkView course={heightfield} rig={rig} animating revision={0} poseAt={poseAt} aim={aim} height={viewHeight} label="The character walking live as you drive it" />
        ) : (
          <View style={[styles.placeholder, { height: viewHeight }]}>
            <Text style={styles.note}>{ground.loaded && !list.length ? 'Make a course to drive on.' : 'Loading the course…'}</Text>
          </View>
        )}
        {flash ? (
          <View style={[styles.flash, compact && styles.flashLow, { borderColor: stumbleColor(flash.kind) }]} role="alert" testID="drive-flash">
            <StumbleGlyph kind={flash.kind} size={18} />
            <Text style={[styles.flashText, { color: stumbleColor(flash.kind) }]}>{STUMBLE_LABELS[flash.kind]}</Text>
          </View>
        ) : null}
        {/* On a phone the preview sticks above the form: the camera choice sits on the view rather than below it. */}
        {compact ? <View style={styles.cameraSpot}>{cameraChips}</View> : null}
        {wide ? null : (
          <View style={styles.stickSpot}>
            <Thumbstick value={stick} label="Walk stick: push up to walk, sideways to turn" />
          </View>
        )}
      </View>
      {error ? <Notice message={error} /> : null}
      {readout.problem ? <Notice message={readout.problem} /> : null}
      <View style={styles.readout}>
        <Text style={styles.readoutText} testID="drive-position">
          x <Text style={styles.fig}>{finite ? readout.x.toFixed(2) : '—'}</Text> m · z <Text style={styles.fig}>{finite ? readout.z.toFixed(2) : '—'}</Text> m · walked{' '}
          <Text style={styles.fig}>{finite ? readout.walked.toFixed(2) : '—'}</Text> m · facing <Text style={styles.fig}>{Number.isFinite(readout.heading) ? Math.round(degrees(readout.heading)) : '—'}</Text>°
          {readout.resting ? ' · standing' : ''}
        </Text>
        <Pressable onPress={() => setRestart((r) => r + 1)} role="button" style={styles.restart}>
          <Text style={styles.restartText}>Back to the start</Text>
        </Pressable>
      </View>
      <View style={styles.counts}>
        {STUMBLE_KIND_NAMES.map((k, i) => (
          <View key={k} style={styles.count}>
            <StumbleGlyph kind={k} />
            <Text style={styles.countText}>
              {STUMBLE_LABELS[k]} <Text style={styles.fig}>{readout.counts[i]}</Text>
            </Text>
          </View>
        ))}
      </View>
      <Text style={styles.note}>
        {wide ? 'Hold W or ↑ to walk, A D or ← → to turn; let go and the feet come to rest. ' : 'Push the stick up to walk, sideways to turn; let go and the feet come to rest. '}
        Driving runs the settings in the form, saved or not, through the same runtime a game uses.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  compactHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  compactTitle: { ...type.label, color: colors.ink, flexShrink: 1 },
  nextCourse: { minHeight: 44, paddingHorizontal: space.sm, justifyContent: 'center' },
  nextCourseText: { ...type.label, color: colors.ember },
  placeholder: { alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paperDeep, borderRadius: radius.lg },
  flash: { position: 'absolute', top: space.sm, left: space.sm, flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.md, minHeight: 44, borderRadius: radius.md, borderWidth: 2, backgroundColor: colors.card },
  flashText: { fontFamily: fonts.bodyStrong, fontSize: 16 },
  flashLow: { top: undefined, bottom: space.md },
  stickSpot: { position: 'absolute', right: space.md, bottom: space.md },
  cameraSpot: { position: 'absolute', top: space.sm, right: space.sm },
  readout: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  restart: { minHeight: 44, justifyContent: 'center', paddingHorizontal: space.sm },
  restartText: { ...type.label, color: colors.ember },
  readoutText: { ...type.small, color: colors.ink },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  count: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  countText: { ...type.small, color: colors.ink },
  fig: { fontFamily: fonts.mono },
  note: { ...type.small, color: colors.graphite },
});
