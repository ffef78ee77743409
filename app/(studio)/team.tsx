import { Linking, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import { colors, space, type } from '../../constants/theme';
import { useMe } from '../../hooks/useSession';
import { useCan } from '../../hooks/useCan';
import { useBilling } from '../../hooks/useBilling';
import { useQueueStatus } from '../../hooks/useQueue';
import { useAuditLog, useChangeRole, useInvite, usePermissionTable, useRemoveMember, useResendInvite, useRevokeInvite, useSignOutEverywhere, useTeam } from '../../hooks/useTeam';
import { useAppConfig } from '../../hooks/useAccountLinks';
import { Screen } from '../../components/layout/Screen';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { Button } from '../../components/ui/Button';
import { Card } from '../../components/ui/Card';
import { SectionHeading } from '../../components/ui/SectionHeading';
import { AuditLog } from '../../components/team/AuditLog';
import { InviteForm } from '../../components/team/InviteForm';
import { MemberList } from '../../components/team/MemberList';
import { PendingInvites } from '../../components/team/PendingInvites';
import { PermissionMatrix } from '../../components/team/PermissionMatrix';
import { QueueStatusSection } from '../../components/team/QueueStatus';
import { StudioLinks } from '../../components/team/StudioLinks';

export default function TeamScreen() {
  const me = useMe();
  const team = useTeam();
  const table = usePermissionTable();
  const canInvite = useCan('team.invite');
  const canManage = useCan('team.change-role');
  const canReadLog = useCan('team.audit');
  const canReadQueue = useCan('queue.read');
  const mayManageBilling = useCan('billing.manage');
  const mayManageTokens = useCan('tokens.manage');
  const audit = useAuditLog(canReadLog);
  const queue = useQueueStatus(canReadQueue);
  const billing = useBilling();
  const config = useAppConfig();
  const signOutEverywhere = useSignOutEverywhere();
  const invite = useInvite();
  const resend = useResendInvite();
  const revoke = useRevokeInvite();
  const changeRole = useChangeRole();
  const remove = useRemoveMember();
  const router = useRouter();

  if (team.isPending || !me.data) return <LoadingPage />;
  if (team.isError) return <LoadingPage problem={team.error.message} onRetry={() => team.refetch()} />;
  const inbox = config.data?.localInboxUrl;

  return (
    <Screen
      title="Team"
      lede={canManage ? 'Who is in the studio and what each role may do. Changes take effect at once.' : 'Who is in the studio and what each role may do.'}
    >
      <StudioLinks planName={billing.data?.plan.name} mayManageBilling={mayManageBilling} mayManageTokens={mayManageTokens} />

      <SectionHeading>Members</SectionHeading>
      <MemberList members={team.data.members} manage={canManage} viewerId={me.data.user.id} changes={{ changeRole, remove }} />

      {canInvite && (
        <>
          <SectionHeading>Invite someone</SectionHeading>
          <InviteForm localInboxUrl={inbox} invite={invite} />
          {inbox ? (
            <View style={styles.inbox}>
              <Text style={styles.inboxText}>Running locally: mail goes to a local inbox on this machine, not to real addresses.</Text>
              <Button label="Open the local inbox" tone="quiet" onPress={() => Linking.openURL(inbox)} />
            </View>
          ) : null}
          <SectionHeading>Waiting for an answer</SectionHeading>
          <PendingInvites invites={team.data.invites ?? []} resend={resend} revoke={revoke} />
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

      {canReadQueue ? <QueueStatusSection status={queue} /> : null}

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
