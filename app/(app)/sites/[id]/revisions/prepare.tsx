import { useLocalSearchParams } from 'expo-router';

import { PrepareRevisionScreen } from '../../../../../src/components/revisions';

export default function PrepareRevisionRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <PrepareRevisionScreen siteId={typeof id === 'string' ? id : ''} />;
}
