import { useLocalSearchParams } from 'expo-router';

import { AcceptInviteForm } from '../../src/components/auth';

export default function AcceptInviteRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return <AcceptInviteForm token={typeof token === 'string' && token ? token : undefined} />;
}
