import { useLocalSearchParams } from 'expo-router';

import { OverviewScreen } from '../../../../src/components/overview';

export default function SiteOverviewRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <OverviewScreen siteId={typeof id === 'string' ? id : ''} />;
}
