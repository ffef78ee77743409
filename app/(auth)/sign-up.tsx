import { SignUpForm } from '../../components/forms/SignUpForm';
import { useAppConfig } from '../../hooks/useAccountLinks';
import { useSignUp } from '../../hooks/useSession';

export default function SignUpScreen() {
  const signUp = useSignUp();
  const config = useAppConfig();
  return <SignUpForm signUp={signUp} localInboxUrl={config.data?.localInboxUrl} />;
}
