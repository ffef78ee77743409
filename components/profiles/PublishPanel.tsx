import { useState } from 'react';
import { StyleSheet, Text } from 'react-native';
import { useRouter } from 'expo-router';
import { colors, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { PublishProfileInput } from '../../schemas/profiles';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { SectionHeading } from '../ui/SectionHeading';
import { TextField } from '../ui/TextField';

/** Publishes a character's newest saved leg setup (or its defaults) as the next immutable profile version. */
export function PublishPanel({ characters, suites, publish }: { characters: readonly { id: number; name: string }[]; suites: readonly { id: number; name: string }[]; publish: Mutation<PublishProfileInput, { profileId: number; version: number }> }) {
  const router = useRouter();
  const [characterId, setCharacterId] = useState<string>();
  const [suiteId, setSuiteId] = useState<string>();
  const [notes, setNotes] = useState('');
  const fields = publish.error?.fields ?? {};
  return (
    <Card>
      <SectionHeading>Publish a version</SectionHeading>
      <Text style={styles.body}>
        Treadle walks the character over the suite with its newest saved leg setup and stores the result as the next version. A published version never changes.
      </Text>
      <ChoiceChips label="Character" choices={characters.map((c) => ({ value: String(c.id), label: c.name }))} value={characterId} onChange={setCharacterId} error={fields.characterId} />
      <ChoiceChips label="Suite" choices={suites.map((s) => ({ value: String(s.id), label: s.name }))} value={suiteId} onChange={setSuiteId} error={fields.suiteId} />
      <TextField label="What changed" value={notes} onChangeText={setNotes} placeholder="e.g. More damping for the dock steps" error={fields.notes} multiline />
      {publish.error && !Object.keys(fields).length ? <Notice message={publish.error.message} /> : null}
      <Button
        label="Publish version"
        busy={publish.isPending}
        disabled={!characterId || !suiteId}
        onPress={() =>
          publish.mutate(
            { characterId: Number(characterId), suiteId: Number(suiteId), notes },
            { onSuccess: (r) => router.push(`/profiles/${r.profileId}`) },
          )
        }
      />
    </Card>
  );
}

const styles = StyleSheet.create({ body: { ...type.body, color: colors.graphite } });
