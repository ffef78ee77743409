import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { AcceptInviteForm } from '../../components/forms/AcceptInviteForm';
import { LinkProblem } from '../../components/forms/LinkProblem';
import { useInvitePreview } from '../../hooks/useAccountLinks';

export default function InviteScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const invite = useInvitePreview(token);
  return (
    <AuthFrame>
      {invite.isPending ? (
        <LoadingPage />
      ) : invite.isError ? (
        <LinkProblem title="This invite cannot be used" message={invite.error.message} />
      ) : (
        <AcceptInviteForm token={token} invite={invite.data} />
      )}
    </AuthFrame>
  );
}
