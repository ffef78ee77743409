import { useEffect, useState } from 'react';
import { WalkPathSchema } from '../../engine/course/walk-path';
import { TextField } from '../ui/TextField';

/** The walk path's own speed field, straight from the one walk-path schema (its bounds and its messages). */
const speedSchema = WalkPathSchema.shape.speed;
const speedBounds = speedSchema.unwrap().unwrap();

/** What a typed speed means: empty is the leg setup's own pace (null); anything else a number, NaN if it is none. */
export function speedFromText(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (!t) return null;
  return /^[+-]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number(t) : NaN;
}

/** The schema's message for a speed, or null when it passes. */
export function speedProblem(speed: number | null): string | null {
  if (speed !== null && Number.isNaN(speed)) return 'Type the speed as a number of metres a second, such as 1.2, or leave it empty.';
  const checked = speedSchema.safeParse(speed);
  return checked.success ? null : checked.error.issues[0].message;
}

const textOf = (speed: number | null) => (speed === null || Number.isNaN(speed) ? '' : String(speed));

/**
 * How fast trials walk the path, m/s; empty walks it at the leg setup's own pace. What is typed goes into the path
 * as it is (out of range too), so Save checks it with the rest of the course and nothing is dropped unseen; the
 * schema's message shows under the field at once.
 */
export function WalkPathSpeedField({ speed, onChange, error, editable = true }: { speed: number | null; onChange(speed: number | null): void; error?: string; editable?: boolean }) {
  const [text, setText] = useState(() => textOf(speed));
  // A path replaced from outside (reloaded, set anew) shows its own speed; one typed here keeps its text.
  useEffect(() => {
    if (!Object.is(speedFromText(text), speed)) setText(textOf(speed));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [speed]);
  const typed = speedFromText(text);
  return (
    <TextField
      label="Speed along the path (m/s)"
      value={text}
      onChangeText={(v) => {
        setText(v);
        onChange(speedFromText(v));
      }}
      inputMode="decimal"
      placeholder="The leg setup's own pace"
      editable={editable}
      error={speedProblem(typed) ?? error}
      hint={`Above ${speedBounds.minValue} and at most ${speedBounds.maxValue} m/s; leave it empty to walk at the leg setup's own pace.`}
    />
  );
}
