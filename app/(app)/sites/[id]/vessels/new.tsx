import { Stack, useLocalSearchParams } from 'expo-router';

import { NewItemScreen } from '../../../../../src/components/lines';

export default function NewVesselRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Add a vessel · Lagline' }} />
      <NewItemScreen siteId={typeof id === 'string' ? id : ''} kind="vessel" />
    </>
  );
}
