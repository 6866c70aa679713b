import { Stack, useLocalSearchParams } from 'expo-router';

import { ItemScreen } from '../../../src/components/lines';

export default function VesselRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Vessel · Lagline' }} />
      <ItemScreen id={typeof id === 'string' ? id : ''} kind="vessel" />
    </>
  );
}
