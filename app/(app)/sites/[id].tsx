import { useLocalSearchParams } from 'expo-router';

import { SiteDetailScreen } from '../../../src/components/sites';

export default function SiteRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <SiteDetailScreen id={typeof id === 'string' ? id : ''} />;
}
