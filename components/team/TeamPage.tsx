import { Linking, StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { useMe } from '../../hooks/useSession';
import { useCan } from '../../hooks/useCan';
import { useAuditLog, usePermissionTable, useSignOutEverywhere, useTeam } from '../../hooks/useTeam';
import { useAppConfig } from '../../hooks/useAccountLinks';
import { useRouter } from 'expo-router';
import { Screen } from '../layout/Screen';
import { LoadingPage } from '../layout/LoadingPage';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { AuditLog } from './AuditLog';
import { InviteForm } from './InviteForm';
import { MemberList } from './MemberList';
import { PendingInvites } from './PendingInvites';
import { PermissionMatrix } from './PermissionMatrix';
import { QueueStatusSection } from './QueueStatus';
import { StudioLinks } from './StudioLinks';

export function TeamPage() {
  const me = useMe();
  const team = useTeam();
  const table = usePermissionTable();
  const canInvite = useCan('team.invite');
  const canManage = useCan('team.change-role');
  const canReadLog = useCan('team.audit');
  const audit = useAuditLog(canReadLog);
  const config = useAppConfig();
  const signOutEverywhere = useSignOutEverywhere();
  const router = useRouter();

  if (team.isPending || !me.data) return <LoadingPage />;
  if (team.isError) return <LoadingPage problem={team.error.message} onRetry={() => team.refetch()} />;
  const inbox = config.data?.localInboxUrl;

  return (
    <Screen
      title="Team"
      lede={canManage ? 'Who is in the studio and what each role may do. Changes take effect at once.' : 'Who is in the studio and what each role may do.'}
    >
      <StudioLinks />

      <SectionHeading>Members</SectionHeading>
      <MemberList members={team.data.members} manage={canManage} viewerId={me.data.user.id} />

      {canInvite && (
        <>
          <SectionHeading>Invite someone</SectionHeading>
          <InviteForm localInboxUrl={inbox} />
          {inbox ? (
            <View style={styles.inbox}>
              <Text style={styles.inboxText}>Running locally: mail goes to a local inbox on this machine, not to real addresses.</Text>
              <Button label="Open the local inbox" tone="quiet" onPress={() => Linking.openURL(inbox)} />
            </View>
          ) : null}
          <SectionHeading>Waiting for an answer</SectionHeading>
          <PendingInvites invites={team.data.invites ?? []} />
        </>
      )}

      <SectionHeading>Who may do what</SectionHeading>
      {table.data ? <PermissionMatrix rows={table.data.actions} /> : null}

      {canReadLog && (
        <>
          <SectionHeading>Team log</SectionHeading>
          <AuditLog entries={audit.data?.entries ?? []} />
        </>
      )}

      <QueueStatusSection />

      <SectionHeading>Your sessions</SectionHeading>
      <Card>
        <Text style={styles.body}>Lost a phone or signed in on a shared machine? This ends every Treadle session of yours, this one included.</Text>
        <View style={styles.row}>
          <Button
            label="Sign out everywhere"
            tone="danger"
            busy={signOutEverywhere.isPending}
            onPress={() => signOutEverywhere.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })}
          />
        </View>
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  inbox: { gap: space.sm },
  inboxText: { ...type.small, color: colors.graphite },
  body: { ...type.body, color: colors.ink },
  row: { flexDirection: 'row' },
});
