import { SignInForm } from '../../components/forms/SignInForm';

export default function SignInScreen() {
  return <SignInForm />;
}
