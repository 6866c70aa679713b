import { useLocalSearchParams } from 'expo-router';

import { NewItemScreen } from '../../../../../src/components/lines';

export default function NewVesselRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <NewItemScreen siteId={typeof id === 'string' ? id : ''} kind="vessel" />;
}
