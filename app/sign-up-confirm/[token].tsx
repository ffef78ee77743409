import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { ConfirmSignUp } from '../../components/forms/ConfirmSignUp';
import { useConfirmSignUp } from '../../hooks/useSession';

export default function ConfirmSignUpScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const confirm = useConfirmSignUp(token);
  return (
    <AuthFrame>
      <ConfirmSignUp confirm={confirm} />
    </AuthFrame>
  );
}
