import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { ConfirmSignUp } from '../../components/forms/ConfirmSignUp';

export default function ConfirmSignUpScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return (
    <AuthFrame>
      <ConfirmSignUp token={token} />
    </AuthFrame>
  );
}
