import { Redirect, Slot } from 'expo-router';
import { useMe } from '../../hooks/useSession';
import { AuthFrame } from '../../components/layout/AuthFrame';

export default function AuthLayout() {
  const me = useMe();
  if (me.data) return <Redirect href="/" />;
  return (
    <AuthFrame>
      <Slot />
    </AuthFrame>
  );
}
