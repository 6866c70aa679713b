import { useLocalSearchParams } from 'expo-router';

import { ResetPasswordForm } from '../../src/components/auth';

export default function ResetPasswordRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return <ResetPasswordForm token={typeof token === 'string' && token ? token : undefined} />;
}
