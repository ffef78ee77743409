import { useEffect, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { PickChips } from './PickChips';

export const MAX_PICKS = 4;

/** Why some chips are greyed: said next to them, not left to guess. */
export const FULL_HINT = `${MAX_PICKS} picked, the most one comparison shows. Untick one to pick another.`;

/** The character's newest versions (up to the cap), newest first: what "versions of one character" starts from. */
export const versionPicks = (versions: readonly { id: number }[]) => versions.slice(0, MAX_PICKS).map((v) => `s${v.id}`);

/**
 * Which suite, and which 2–4 characters (their newest leg setup) or saved leg setup versions. `versions` are the
 * saved leg setup versions of the character chosen under "versions of one character" (`versionsOf`), once loaded.
 */
export function ComparePicker({
  suite,
  picks,
  onSuite,
  onPicks,
  suites: suiteList,
  characters: list,
  versionsOf,
  onVersionsOf,
  versions,
}: {
  suite: string | undefined;
  picks: string[];
  onSuite(s: string): void;
  onPicks(p: string[]): void;
  suites: readonly { id: number; name: string }[];
  characters: readonly { id: number; name: string }[];
  versionsOf: string | undefined;
  onVersionsOf(characterId: string): void;
  versions: readonly { id: number; version: number; note: string | null }[] | undefined;
}) {
  // Set when a character is chosen under "versions of one character": its versions replace the pick once loaded.
  const [replacing, setReplacing] = useState(false);
  const toggle = (v: string) => onPicks(picks.includes(v) ? picks.filter((p) => p !== v) : [...picks, v].slice(0, MAX_PICKS));
  const full = picks.length >= MAX_PICKS;

  // With only one suite there is nothing to choose: pick it.
  const onlySuite = suiteList.length === 1 ? String(suiteList[0].id) : undefined;
  useEffect(() => {
    if (!suite && onlySuite) onSuite(onlySuite);
  }, [suite, onlySuite, onSuite]);

  useEffect(() => {
    if (!replacing || !versions) return;
    setReplacing(false);
    onPicks(versionPicks(versions));
  }, [replacing, versions, onPicks]);

  return (
    <Card>
      <ChoiceChips label="Suite" choices={suiteList.map((s) => ({ value: String(s.id), label: s.name }))} value={suite} onChange={onSuite} />
      <PickChips label={`Characters, each with its newest leg setup (${picks.length} of 2–${MAX_PICKS} picked)`} choices={list.map((c) => ({ value: `c${c.id}`, label: c.name }))} picked={picks} onToggle={toggle} full={full} />
      <ChoiceChips
        label="Or versions of one character (replaces the pick)"
        choices={list.map((c) => ({ value: String(c.id), label: c.name }))}
        value={versionsOf}
        onChange={(id) => {
          onVersionsOf(id);
          setReplacing(true);
        }}
      />
      {versionsOf && versions ? (
        versions.length ? (
          <PickChips
            label="Leg setup versions"
            choices={versions.map((v) => ({ value: `s${v.id}`, label: `leg setup v${v.version}`, detail: v.note || undefined }))}
            picked={picks}
            onToggle={toggle}
            full={full}
          />
        ) : (
          <Text style={styles.hint}>This character has no saved leg setup versions yet.</Text>
        )
      ) : null}
      {full ? (
        <Text style={styles.hint} role="status">
          {FULL_HINT}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({ hint: { ...type.small, color: colors.graphite }, wrap: { gap: space.sm } });
