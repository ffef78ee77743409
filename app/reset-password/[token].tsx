import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../../components/layout/AuthFrame';
import { NewPasswordForm } from '../../components/forms/NewPasswordForm';

export default function ResetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return (
    <AuthFrame>
      <NewPasswordForm token={token} />
    </AuthFrame>
  );
}
