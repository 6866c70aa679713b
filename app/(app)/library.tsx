import { useLocalSearchParams } from 'expo-router';

import { LibraryScreen } from '../../src/components/library';

export default function LibraryRoute() {
  const { site } = useLocalSearchParams<{ site?: string }>();
  return <LibraryScreen fromSite={typeof site === 'string' ? site : undefined} />;
}
