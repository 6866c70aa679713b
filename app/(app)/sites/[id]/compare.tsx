import { useLocalSearchParams } from 'expo-router';

import { CompareScreen } from '../../../../src/components/revisions';

export default function CompareRoute() {
  const { id, from, to } = useLocalSearchParams<{ id: string; from?: string; to?: string }>();
  return <CompareScreen siteId={typeof id === 'string' ? id : ''} from={typeof from === 'string' ? from : undefined} to={typeof to === 'string' ? to : undefined} />;
}
