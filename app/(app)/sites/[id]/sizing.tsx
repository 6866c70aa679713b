import { useLocalSearchParams } from 'expo-router';

import { SizingSettingsScreen } from '../../../../src/components/lines';

export default function SiteSizingSettingsRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <SizingSettingsScreen siteId={typeof id === 'string' ? id : ''} />;
}
