import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { useCharacters } from '../../hooks/useCharacters';
import { useSuites } from '../../hooks/useCourses';
import { useLegSetups } from '../../hooks/useLegSetups';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { PickChips } from './PickChips';

export const MAX_PICKS = 4;

/** Which suite, and which 2–4 characters (their newest leg setup) or saved leg setup versions. */
export function ComparePicker({ suite, picks, onSuite, onPicks }: { suite: string | undefined; picks: string[]; onSuite(s: string): void; onPicks(p: string[]): void }) {
  const suites = useSuites();
  const characters = useCharacters();
  const list = characters.data?.characters ?? [];
  const [versionsOf, setVersionsOf] = useState<string>();
  const setups = useLegSetups(versionsOf ? Number(versionsOf) : 0);
  const toggle = (v: string) => onPicks(picks.includes(v) ? picks.filter((p) => p !== v) : [...picks, v].slice(0, MAX_PICKS));
  const full = picks.length >= MAX_PICKS;
  return (
    <Card>
      <ChoiceChips label="Suite" choices={(suites.data?.suites ?? []).map((s) => ({ value: String(s.id), label: s.name }))} value={suite} onChange={onSuite} />
      <PickChips label={`Characters (${picks.length} of 2–${MAX_PICKS} picked)`} choices={list.map((c) => ({ value: `c${c.id}`, label: c.name }))} picked={picks} onToggle={toggle} full={full} />
      <ChoiceChips label="Or versions of one character" choices={list.map((c) => ({ value: String(c.id), label: c.name }))} value={versionsOf} onChange={setVersionsOf} />
      {versionsOf && setups.data ? (
        setups.data.versions.length ? (
          <PickChips
            label="Leg setup versions"
            choices={setups.data.versions.map((v) => ({ value: `s${v.id}`, label: `v${v.version}${v.note ? ` · ${v.note.slice(0, 24)}` : ''}` }))}
            picked={picks}
            onToggle={toggle}
            full={full}
          />
        ) : (
          <Text style={styles.hint}>This character has no saved leg setup versions yet.</Text>
        )
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({ hint: { ...type.small, color: colors.graphite }, wrap: { gap: space.sm } });
