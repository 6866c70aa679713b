import { ForgotPasswordForm } from '../../src/components/auth';

export default function ForgotPasswordRoute() {
  return <ForgotPasswordForm />;
}
