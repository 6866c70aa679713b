import { useLocalSearchParams } from 'expo-router';

import { RegisterScreen } from '../../src/components/register';

export default function RegisterRoute() {
  const { siteId } = useLocalSearchParams<{ siteId?: string }>();
  return <RegisterScreen initialSiteId={typeof siteId === 'string' && /^\d+$/.test(siteId) ? siteId : undefined} />;
}
