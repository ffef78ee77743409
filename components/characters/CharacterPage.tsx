import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { Link } from 'expo-router';
import type { CharacterDetail, LegMapping } from '../../schemas/characters';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { Screen } from '../layout/Screen';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { SectionHeading } from '../ui/SectionHeading';
import { formatMoment } from '../ui/format';
import { CharacterViewer } from '../viewer/CharacterViewer';
import { displayUnitOf, formatBytes } from './format';
import { ImportReportView } from './ImportReportView';
import { LegList } from './LegList';
import { LegMappingForm } from './LegMappingForm';
import { CharacterActions } from './CharacterActions';
import type { Mutation } from '../../hooks/mutation';
import { UnitFix } from './UnitFix';

/** A character: the 3D view, its legs (and the form to correct them), and the import report. */
export function CharacterPage({
  detail,
  fileUrl,
  mayEdit,
  mayDialIn,
  setUnitScale,
  onSaveLegs,
}: {
  detail: CharacterDetail;
  fileUrl: string;
  mayEdit: boolean;
  mayDialIn: boolean;
  setUnitScale: Mutation<number>;
  onSaveLegs(legs: LegMapping[]): Promise<void>;
}) {
  const wide = useIsWide();
  const [editing, setEditing] = useState(false);
  const { character, skeleton, report, detectedLegs } = detail;
  const lede = `${character.legCount} legs · ${character.jointCount} joints · ${formatBytes(character.byteSize)} · uploaded by ${character.uploadedBy.name}, ${formatMoment(character.createdAt)}`;

  // Lengths in the file's apparent unit until a unit fix is stored, then in metres.
  const unit = displayUnitOf(detail);
  // Rig quirks and detection doubts that concern particular legs, with what to do about them (engine/rig/rig-quirks.ts).
  const legNotes = report.notes.filter((n) => n.legs?.length);
  const legs = (
    <Card>
      <View style={styles.sectionHead}>
        <SectionHeading>Legs</SectionHeading>
        {mayEdit && !editing ? <Button label="Edit legs" tone="quiet" onPress={() => setEditing(true)} /> : null}
      </View>
      <Text style={styles.note}>{character.legsEdited ? 'Mapping confirmed by your team.' : 'As Treadle found them. Check them before the first trial.'}</Text>
      {editing ? (
        <LegMappingForm
          initial={character.legs}
          detected={detectedLegs}
          joints={skeleton.joints}
          onCancel={() => setEditing(false)}
          onSave={async (next) => {
            await onSaveLegs(next);
            setEditing(false);
          }}
        />
      ) : (
        <LegList legs={character.legs} joints={skeleton.joints} detected={character.legsEdited ? undefined : detectedLegs} unit={unit} />
      )}
      {legNotes.length ? (
        <View style={styles.legNotes} aria-label="What to know about these legs">
          {legNotes.map((n, i) => (
            <Text key={i} style={styles.legNote}>
              {n.message}
            </Text>
          ))}
        </View>
      ) : null}
    </Card>
  );
  const viewer = <CharacterViewer fileUrl={fileUrl} joints={skeleton.joints} legs={character.legs} unitScale={character.unitScale} height={wide ? 520 : 340} />;
  const reportCard = (
    <Card>
      <SectionHeading>Import report</SectionHeading>
      <ImportReportView report={report} unitScale={character.unitScale} unit={unit} />
    </Card>
  );
  return (
    <Screen title={character.name} lede={lede} actions={<Link href="/characters" style={styles.back}>All characters</Link>}>
      <CharacterActions characterId={character.id} mayDialIn={mayDialIn} />
      <UnitFix detail={detail} mayEdit={mayEdit} set={setUnitScale} />
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.main}>
            {viewer}
            {reportCard}
          </View>
          <View style={styles.side}>{legs}</View>
        </View>
      ) : (
        <>
          {viewer}
          {legs}
          {reportCard}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  main: { flex: 3, gap: space.lg },
  side: { flex: 2, gap: space.lg },
  sectionHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
  note: { ...type.small, color: colors.graphite },
  legNotes: { gap: space.sm, marginTop: space.sm },
  legNote: { ...type.small, color: colors.ink, borderLeftWidth: 3, borderLeftColor: colors.rule, paddingLeft: space.md },
  back: { ...type.label, color: colors.ember, paddingVertical: space.md, minHeight: 44 },
});
