import { SignInForm } from '../../components/forms/SignInForm';
import { useSignIn } from '../../hooks/useSession';

export default function SignInScreen() {
  const signIn = useSignIn();
  return <SignInForm signIn={signIn} />;
}
