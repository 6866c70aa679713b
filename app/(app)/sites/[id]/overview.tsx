import { Stack, useLocalSearchParams } from 'expo-router';

import { OverviewScreen } from '../../../../src/components/overview';

export default function SiteOverviewRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Overview · Lagline' }} />
      <OverviewScreen siteId={typeof id === 'string' ? id : ''} />
    </>
  );
}
