import { useLocalSearchParams } from 'expo-router';

import { RevisionsScreen } from '../../../../../src/components/revisions';

export default function SiteRevisionsRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <RevisionsScreen siteId={typeof id === 'string' ? id : ''} />;
}
