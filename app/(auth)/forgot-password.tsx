import { ResetRequestForm } from '../../components/forms/ResetRequestForm';
import { useResetRequest } from '../../hooks/useAccountLinks';

export default function ForgotPasswordScreen() {
  const request = useResetRequest();
  return <ResetRequestForm request={request} />;
}
