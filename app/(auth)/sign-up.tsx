import { SignUpForm } from '../../components/forms/SignUpForm';

export default function SignUpScreen() {
  return <SignUpForm />;
}
