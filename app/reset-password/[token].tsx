import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { NewPasswordForm } from '../../components/forms/NewPasswordForm';
import { useResetPassword } from '../../hooks/useAccountLinks';

export default function ResetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const reset = useResetPassword();
  return (
    <AuthFrame>
      <NewPasswordForm token={token} reset={reset} />
    </AuthFrame>
  );
}
