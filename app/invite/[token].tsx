import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { AcceptInviteForm } from '../../components/forms/AcceptInviteForm';
import { LinkProblem } from '../../components/forms/LinkProblem';
import { useAcceptInvite, useInvitePreview } from '../../hooks/useAccountLinks';

export default function InviteScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const invite = useInvitePreview(token);
  const accept = useAcceptInvite(token);
  return (
    <AuthFrame>
      {invite.isPending ? (
        <LoadingPage />
      ) : invite.isError ? (
        <LinkProblem title="This invite cannot be used" message={invite.error.message} />
      ) : (
        <AcceptInviteForm invite={invite.data} accept={accept} />
      )}
    </AuthFrame>
  );
}
