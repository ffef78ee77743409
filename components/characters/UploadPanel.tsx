import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { Link } from 'expo-router';
import * as DocumentPicker from 'expo-document-picker';
import { colors, radius, space, type } from '../../constants/theme';
import type { CharacterUpload, PickedFile } from '../../hooks/useCharacters';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { ImportReportView } from './ImportReportView';
import { displayUnitOf } from './format';

/** Pick a .glb, or a .gltf together with its .bin and images, send it with progress, then show what the import found. */
export function UploadPanel({ upload: { upload, progress, phase, result, error, reset, busy } }: { upload: CharacterUpload }) {
  const [picking, setPicking] = useState(false);

  async function pick() {
    setPicking(true);
    try {
      const picked = await DocumentPicker.getDocumentAsync({ multiple: true, copyToCacheDirectory: false, type: ['.glb', '.gltf', '.bin', 'image/*', 'model/gltf-binary', 'model/gltf+json'] });
      if (picked.canceled) return;
      const files: PickedFile[] = [];
      for (const asset of picked.assets) {
        // On web the picker hands over the browser's File; elsewhere the file is read from its URI.
        const blob = asset.file ?? (await (await fetch(asset.uri)).blob());
        files.push({ name: asset.name, file: blob });
      }
      await upload(files);
    } finally {
      setPicking(false);
    }
  }

  const percent = progress === null ? 0 : Math.round(progress * 100);
  return (
    <Card>
      <View style={styles.head}>
        <View style={styles.titles}>
          <Text style={styles.title}>Upload a character</Text>
          <Text style={styles.lede}>A .glb, or a .gltf picked together with its .bin and images. Up to 50 MB.</Text>
        </View>
        <Button label={result || error ? 'Upload another' : 'Choose file'} onPress={() => { reset(); void pick(); }} busy={picking || busy} />
      </View>
      {phase === 'sending' || phase === 'importing' ? (
        <View style={styles.progressWrap} aria-label="Upload progress">
          <View role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} style={styles.track}>
            <View style={[styles.bar, { width: `${percent}%` }]} />
          </View>
          <Text style={styles.progressText}>{phase === 'sending' ? `Sending… ${percent}%` : 'Reading the skeleton and finding the legs…'}</Text>
        </View>
      ) : null}
      {error ? <Notice message={error.message} /> : null}
      {result ? (
        <View style={styles.result}>
          <Text style={styles.done}>
            {result.existing ? `This file is already here as ${result.character.name}.` : `${result.character.name} is in, with ${result.character.legCount} legs found.`}
          </Text>
          <Link href={`/characters/${result.character.id}`} style={styles.open}>
            Open {result.character.name}
          </Link>
          <ImportReportView report={result.report} unitScale={result.character.unitScale} unit={displayUnitOf(result)} />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'center', justifyContent: 'space-between' },
  titles: { flexShrink: 1, gap: space.xs, minWidth: 200 },
  title: { ...type.heading, color: colors.ink },
  lede: { ...type.small, color: colors.graphite },
  progressWrap: { gap: space.xs },
  track: { height: 8, borderRadius: radius.sm, backgroundColor: colors.paperDeep, overflow: 'hidden' },
  bar: { height: 8, backgroundColor: colors.ember },
  progressText: { ...type.small, color: colors.graphite },
  result: { gap: space.md },
  done: { ...type.body, color: colors.ink },
  open: { ...type.label, color: colors.ember, paddingVertical: space.md, minHeight: 44 },
});
