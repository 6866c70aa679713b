import { useLocalSearchParams } from 'expo-router';

import { ItemListScreen } from '../../../../../src/components/lines';

export default function SiteLinesRoute() {
  const { id, status } = useLocalSearchParams<{ id: string; status?: string }>();
  return <ItemListScreen siteId={typeof id === 'string' ? id : ''} kind="line" initialStatus={typeof status === 'string' ? status : undefined} />;
}
