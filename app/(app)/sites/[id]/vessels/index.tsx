import { useLocalSearchParams } from 'expo-router';

import { ItemListScreen } from '../../../../../src/components/lines';

export default function SiteVesselsRoute() {
  const { id, status } = useLocalSearchParams<{ id: string; status?: string }>();
  return <ItemListScreen siteId={typeof id === 'string' ? id : ''} kind="vessel" initialStatus={typeof status === 'string' ? status : undefined} />;
}
