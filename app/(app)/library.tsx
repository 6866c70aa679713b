import { Stack, useLocalSearchParams } from 'expo-router';

import { LibraryScreen } from '../../src/components/library';

export default function LibraryRoute() {
  const { site } = useLocalSearchParams<{ site?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Library · Lagline' }} />
      <LibraryScreen fromSite={typeof site === 'string' ? site : undefined} />
    </>
  );
}
