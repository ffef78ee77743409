import { ResetRequestForm } from '../../components/forms/ResetRequestForm';

export default function ForgotPasswordScreen() {
  return <ResetRequestForm />;
}
