import { useLocalSearchParams } from 'expo-router';

import { RevisionScreen } from '../../../../../src/components/revisions';

export default function RevisionRoute() {
  const { id, revisionId } = useLocalSearchParams<{ id: string; revisionId: string }>();
  return <RevisionScreen siteId={typeof id === 'string' ? id : ''} revisionId={typeof revisionId === 'string' ? revisionId : ''} />;
}
