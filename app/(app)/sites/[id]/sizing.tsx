import { Stack, useLocalSearchParams } from 'expo-router';

import { SizingSettingsScreen } from '../../../../src/components/lines';

export default function SiteSizingSettingsRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Sizing settings · Lagline' }} />
      <SizingSettingsScreen siteId={typeof id === 'string' ? id : ''} />
    </>
  );
}
